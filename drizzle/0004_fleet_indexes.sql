CREATE INDEX `cameras_fleet_idx` ON `cameras` (`active`,`site_id`,`task_id`,`camera_model_id`,`last_check_at`,`last_verdict`,`next_due_at`);--> statement-breakpoint
CREATE INDEX `cameras_state_check_idx` ON `cameras` (`active`,`state`,`last_check_at`);--> statement-breakpoint
CREATE INDEX `cameras_state_mtf_idx` ON `cameras` (`active`,`state`,`last_mtf50_cy_px`);--> statement-breakpoint
CREATE INDEX `checks_period_idx` ON `checks` (`captured_at`,`camera_id`,`verdict`,`median_mtf50_cy_px`);