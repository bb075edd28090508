CREATE TABLE `attachments` (
	`id` char(36) NOT NULL,
	`check_id` char(36) NOT NULL,
	`measurement_id` char(36),
	`kind` enum('roi','frame') NOT NULL,
	`storage_key` varchar(255) NOT NULL,
	`sha256` char(64) NOT NULL,
	`bytes` int NOT NULL,
	`mime` varchar(64) NOT NULL,
	`width` int NOT NULL,
	`height` int NOT NULL,
	`delete_after` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `attachments_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `audit_log` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`actor_id` int,
	`action` varchar(64) NOT NULL,
	`entity` varchar(40) NOT NULL,
	`entity_id` varchar(64),
	`detail` json,
	`at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `audit_log_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `camera_models` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`sensor_width_px` int NOT NULL,
	`sensor_height_px` int NOT NULL,
	`pixel_pitch_um` double NOT NULL,
	`focal_length_min_mm` double NOT NULL,
	`focal_length_max_mm` double NOT NULL,
	`f_number` double NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `camera_models_id` PRIMARY KEY(`id`),
	CONSTRAINT `camera_models_name_unique` UNIQUE(`name`)
);
--> statement-breakpoint
CREATE TABLE `cameras` (
	`id` int AUTO_INCREMENT NOT NULL,
	`asset_tag` varchar(64) NOT NULL,
	`site_id` int NOT NULL,
	`location_text` varchar(255) NOT NULL DEFAULT '',
	`camera_model_id` int NOT NULL,
	`task_id` varchar(32) NOT NULL,
	`required_px_per_m` double,
	`min_mtf50_cy_px` double,
	`check_interval_days` int,
	`focal_length_mm` double,
	`target_distance_m` double,
	`baseline_check_id` char(36),
	`state` enum('ok','due','failing','in_repair') NOT NULL DEFAULT 'due',
	`last_check_id` char(36),
	`last_check_at` datetime(3),
	`last_verdict` enum('pass','marginal','fail'),
	`last_mtf50_cy_px` double,
	`next_due_at` datetime(3),
	`active` boolean NOT NULL DEFAULT true,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `cameras_id` PRIMARY KEY(`id`),
	CONSTRAINT `cameras_assetTag_unique` UNIQUE(`asset_tag`)
);
--> statement-breakpoint
CREATE TABLE `changes` (
	`seq` bigint unsigned AUTO_INCREMENT NOT NULL,
	`entity` varchar(40) NOT NULL,
	`entity_id` varchar(64) NOT NULL,
	`action` enum('upsert','delete') NOT NULL DEFAULT 'upsert',
	`at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `changes_seq` PRIMARY KEY(`seq`)
);
--> statement-breakpoint
CREATE TABLE `checks` (
	`id` char(36) NOT NULL,
	`camera_id` int NOT NULL,
	`inspector_id` int NOT NULL,
	`round_id` int,
	`captured_at` datetime(3) NOT NULL,
	`mode` enum('day','night') NOT NULL,
	`verdict` enum('pass','marginal','fail') NOT NULL,
	`reasons` json NOT NULL,
	`median_mtf50_cy_px` double,
	`pixel_density_px_per_m` double,
	`baseline_ratio` double,
	`target_id` varchar(64),
	`notes` text,
	`is_baseline` boolean NOT NULL DEFAULT false,
	`device_id` varchar(64) NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`synced_at` datetime(3),
	CONSTRAINT `checks_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `mail_outbox` (
	`id` int AUTO_INCREMENT NOT NULL,
	`to_address` varchar(254) NOT NULL,
	`subject` varchar(255) NOT NULL,
	`text` mediumtext NOT NULL,
	`html` mediumtext,
	`dedupe_key` varchar(191) NOT NULL,
	`status` enum('pending','sent','failed') NOT NULL DEFAULT 'pending',
	`attempts` int NOT NULL DEFAULT 0,
	`next_attempt_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`last_error` text,
	`sent_at` datetime(3),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `mail_outbox_id` PRIMARY KEY(`id`),
	CONSTRAINT `mail_outbox_dedupeKey_unique` UNIQUE(`dedupe_key`)
);
--> statement-breakpoint
CREATE TABLE `measurements` (
	`id` char(36) NOT NULL,
	`check_id` char(36) NOT NULL,
	`roi_x` int NOT NULL,
	`roi_y` int NOT NULL,
	`roi_w` int NOT NULL,
	`roi_h` int NOT NULL,
	`orientation` enum('vertical','horizontal') NOT NULL,
	`angle_deg` double NOT NULL,
	`mtf50_cy_px` double NOT NULL,
	`mtf50p_cy_px` double,
	`mtf10_cy_px` double,
	`mtf_nyquist` double,
	`rise1090_px` double,
	`overshoot` double,
	`noise` double,
	`psf_model` enum('gaussian','disk'),
	`sigma_px` double,
	`radius_px` double,
	`psf_rms` double,
	`mtf_curve` json NOT NULL,
	`warnings` json NOT NULL,
	`server_mtf50_cy_px` double,
	`disagreement` boolean NOT NULL DEFAULT false,
	CONSTRAINT `measurements_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `refresh_tokens` (
	`id` int AUTO_INCREMENT NOT NULL,
	`user_id` int NOT NULL,
	`family_id` char(36) NOT NULL,
	`token_hash` char(64) NOT NULL,
	`expires_at` datetime(3) NOT NULL,
	`revoked_at` datetime(3),
	`replaced_by` int,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `refresh_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `refresh_tokens_tokenHash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `round_cameras` (
	`round_id` int NOT NULL,
	`camera_id` int NOT NULL,
	`check_id` char(36),
	CONSTRAINT `round_cameras_round_id_camera_id_pk` PRIMARY KEY(`round_id`,`camera_id`)
);
--> statement-breakpoint
CREATE TABLE `rounds` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`site_id` int,
	`assignee_id` int NOT NULL,
	`due_at` datetime(3) NOT NULL,
	`status` enum('open','done','cancelled') NOT NULL DEFAULT 'open',
	`created_by` int NOT NULL,
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `rounds_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sites` (
	`id` int AUTO_INCREMENT NOT NULL,
	`name` varchar(120) NOT NULL,
	`address` varchar(255) NOT NULL DEFAULT '',
	`time_zone` varchar(64) NOT NULL DEFAULT 'UTC',
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sites_id` PRIMARY KEY(`id`),
	CONSTRAINT `sites_name_unique` UNIQUE(`name`)
);
--> statement-breakpoint
CREATE TABLE `sync_operations` (
	`op_id` char(36) NOT NULL,
	`device_id` varchar(64) NOT NULL,
	`user_id` int NOT NULL,
	`kind` varchar(40) NOT NULL,
	`status` enum('applied','rejected') NOT NULL,
	`reason` text,
	`result` json,
	`applied_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `sync_operations_op_id` PRIMARY KEY(`op_id`)
);
--> statement-breakpoint
CREATE TABLE `tasks` (
	`id` varchar(32) NOT NULL,
	`name` varchar(80) NOT NULL,
	`description` varchar(500) NOT NULL DEFAULT '',
	`required_px_per_m` double NOT NULL,
	`min_mtf50_cy_px` double NOT NULL,
	`marginal_band` double NOT NULL DEFAULT 0.1,
	`drift_warn_ratio` double NOT NULL DEFAULT 0.8,
	`drift_fail_ratio` double NOT NULL DEFAULT 0.6,
	`night_day_warn_ratio` double NOT NULL DEFAULT 0.8,
	`check_interval_days` int NOT NULL,
	`work_order_priority` enum('low','normal','high','urgent') NOT NULL DEFAULT 'normal',
	`work_order_due_days` int NOT NULL,
	`sort_order` int NOT NULL DEFAULT 0,
	`version` int NOT NULL DEFAULT 1,
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `tasks_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` int AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`role` enum('inspector','supervisor','maintenance','admin') NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`active` boolean NOT NULL DEFAULT true,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `work_order_history` (
	`id` int AUTO_INCREMENT NOT NULL,
	`work_order_id` int NOT NULL,
	`actor_id` int,
	`at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`action` varchar(40) NOT NULL,
	`from_status` enum('open','assigned','in_progress','awaiting_recheck','closed','cancelled'),
	`to_status` enum('open','assigned','in_progress','awaiting_recheck','closed','cancelled'),
	`from_assignee_id` int,
	`to_assignee_id` int,
	`check_id` char(36),
	`reason` text,
	`note` text,
	CONSTRAINT `work_order_history_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `work_orders` (
	`id` int AUTO_INCREMENT NOT NULL,
	`camera_id` int NOT NULL,
	`opened_by_check_id` char(36),
	`closed_by_check_id` char(36),
	`priority` enum('low','normal','high','urgent') NOT NULL DEFAULT 'normal',
	`assignee_id` int,
	`due_at` datetime(3),
	`status` enum('open','assigned','in_progress','awaiting_recheck','closed','cancelled') NOT NULL DEFAULT 'open',
	`title` varchar(200) NOT NULL,
	`description` text,
	`created_by` int,
	`closed_at` datetime(3),
	`version` int NOT NULL DEFAULT 1,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `work_orders_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `attachments` ADD CONSTRAINT `attachments_check_id_checks_id_fk` FOREIGN KEY (`check_id`) REFERENCES `checks`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `audit_log` ADD CONSTRAINT `audit_log_actor_id_users_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `cameras` ADD CONSTRAINT `cameras_site_id_sites_id_fk` FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `cameras` ADD CONSTRAINT `cameras_camera_model_id_camera_models_id_fk` FOREIGN KEY (`camera_model_id`) REFERENCES `camera_models`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `cameras` ADD CONSTRAINT `cameras_task_id_tasks_id_fk` FOREIGN KEY (`task_id`) REFERENCES `tasks`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `checks` ADD CONSTRAINT `checks_camera_id_cameras_id_fk` FOREIGN KEY (`camera_id`) REFERENCES `cameras`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `checks` ADD CONSTRAINT `checks_inspector_id_users_id_fk` FOREIGN KEY (`inspector_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `checks` ADD CONSTRAINT `checks_round_id_rounds_id_fk` FOREIGN KEY (`round_id`) REFERENCES `rounds`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `measurements` ADD CONSTRAINT `measurements_check_id_checks_id_fk` FOREIGN KEY (`check_id`) REFERENCES `checks`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `refresh_tokens` ADD CONSTRAINT `refresh_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `round_cameras` ADD CONSTRAINT `round_cameras_round_id_rounds_id_fk` FOREIGN KEY (`round_id`) REFERENCES `rounds`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `round_cameras` ADD CONSTRAINT `round_cameras_camera_id_cameras_id_fk` FOREIGN KEY (`camera_id`) REFERENCES `cameras`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `rounds` ADD CONSTRAINT `rounds_site_id_sites_id_fk` FOREIGN KEY (`site_id`) REFERENCES `sites`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `rounds` ADD CONSTRAINT `rounds_assignee_id_users_id_fk` FOREIGN KEY (`assignee_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `rounds` ADD CONSTRAINT `rounds_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sync_operations` ADD CONSTRAINT `sync_operations_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_order_history` ADD CONSTRAINT `work_order_history_work_order_id_work_orders_id_fk` FOREIGN KEY (`work_order_id`) REFERENCES `work_orders`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_order_history` ADD CONSTRAINT `work_order_history_actor_id_users_id_fk` FOREIGN KEY (`actor_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_camera_id_cameras_id_fk` FOREIGN KEY (`camera_id`) REFERENCES `cameras`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_assignee_id_users_id_fk` FOREIGN KEY (`assignee_id`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `work_orders` ADD CONSTRAINT `work_orders_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `attachments_check_idx` ON `attachments` (`check_id`);--> statement-breakpoint
CREATE INDEX `audit_log_at_idx` ON `audit_log` (`at`);--> statement-breakpoint
CREATE INDEX `audit_log_entity_idx` ON `audit_log` (`entity`,`entity_id`);--> statement-breakpoint
CREATE INDEX `cameras_site_idx` ON `cameras` (`site_id`);--> statement-breakpoint
CREATE INDEX `cameras_state_idx` ON `cameras` (`state`);--> statement-breakpoint
CREATE INDEX `cameras_task_idx` ON `cameras` (`task_id`);--> statement-breakpoint
CREATE INDEX `cameras_model_idx` ON `cameras` (`camera_model_id`);--> statement-breakpoint
CREATE INDEX `cameras_next_due_idx` ON `cameras` (`next_due_at`);--> statement-breakpoint
CREATE INDEX `changes_entity_idx` ON `changes` (`entity`,`entity_id`);--> statement-breakpoint
CREATE INDEX `checks_camera_time_idx` ON `checks` (`camera_id`,`captured_at`);--> statement-breakpoint
CREATE INDEX `checks_time_idx` ON `checks` (`captured_at`);--> statement-breakpoint
CREATE INDEX `checks_inspector_idx` ON `checks` (`inspector_id`,`captured_at`);--> statement-breakpoint
CREATE INDEX `mail_outbox_due_idx` ON `mail_outbox` (`status`,`next_attempt_at`);--> statement-breakpoint
CREATE INDEX `measurements_check_idx` ON `measurements` (`check_id`);--> statement-breakpoint
CREATE INDEX `refresh_tokens_family_idx` ON `refresh_tokens` (`family_id`);--> statement-breakpoint
CREATE INDEX `refresh_tokens_user_idx` ON `refresh_tokens` (`user_id`);--> statement-breakpoint
CREATE INDEX `round_cameras_camera_idx` ON `round_cameras` (`camera_id`);--> statement-breakpoint
CREATE INDEX `rounds_assignee_idx` ON `rounds` (`assignee_id`,`status`);--> statement-breakpoint
CREATE INDEX `rounds_due_idx` ON `rounds` (`due_at`);--> statement-breakpoint
CREATE INDEX `sync_operations_device_idx` ON `sync_operations` (`device_id`,`applied_at`);--> statement-breakpoint
CREATE INDEX `work_order_history_order_idx` ON `work_order_history` (`work_order_id`,`at`);--> statement-breakpoint
CREATE INDEX `work_orders_status_idx` ON `work_orders` (`status`);--> statement-breakpoint
CREATE INDEX `work_orders_assignee_idx` ON `work_orders` (`assignee_id`);--> statement-breakpoint
CREATE INDEX `work_orders_camera_idx` ON `work_orders` (`camera_id`);