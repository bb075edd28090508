CREATE TABLE `work_order_photos` (
	`id` char(36) NOT NULL,
	`work_order_id` int NOT NULL,
	`uploaded_by` int NOT NULL,
	`storage_key` varchar(255) NOT NULL,
	`sha256` char(64) NOT NULL,
	`bytes` int NOT NULL,
	`mime` varchar(64) NOT NULL,
	`width` int NOT NULL,
	`height` int NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `work_order_photos_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `kind` varchar(40) DEFAULT 'other' NOT NULL;--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `claim_token` char(36);--> statement-breakpoint
ALTER TABLE `mail_outbox` ADD `claimed_until` datetime(3);--> statement-breakpoint
ALTER TABLE `work_orders` ADD `open_camera_id` int GENERATED ALWAYS AS ((case when `status` in ('closed', 'cancelled') then null else `camera_id` end)) STORED;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_open_camera_uq` UNIQUE(`open_camera_id`);--> statement-breakpoint
ALTER TABLE `work_order_photos` ADD CONSTRAINT `work_order_photos_work_order_id_work_orders_id_fk` FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_order_photos` ADD CONSTRAINT `work_order_photos_uploaded_by_users_id_fk` FOREIGN KEY (`uploaded_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `work_order_photos_order_idx` ON `work_order_photos` (`work_order_id`);--> statement-breakpoint
CREATE INDEX `mail_outbox_claim_idx` ON `mail_outbox` (`claim_token`);--> statement-breakpoint
CREATE INDEX `work_orders_due_idx` ON `work_orders` (`due_at`);