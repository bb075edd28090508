CREATE TABLE `login_failures` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`attempt_key` varchar(320) NOT NULL,
	`at` datetime(3) NOT NULL,
	CONSTRAINT `login_failures_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE INDEX `login_failures_key_idx` ON `login_failures` (`attempt_key`,`at`);--> statement-breakpoint
CREATE INDEX `login_failures_at_idx` ON `login_failures` (`at`);