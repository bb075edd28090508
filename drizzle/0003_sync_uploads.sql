ALTER TABLE `checks` ADD `share_frame` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `attachments` ADD CONSTRAINT `attachments_check_sha_uq` UNIQUE(`check_id`,`sha256`);--> statement-breakpoint
CREATE INDEX `attachments_delete_after_idx` ON `attachments` (`delete_after`);