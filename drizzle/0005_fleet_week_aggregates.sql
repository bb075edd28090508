CREATE TABLE `fleet_aggregate_state` (
	`id` int NOT NULL,
	`rebuilt_at` datetime(3) NOT NULL,
	CONSTRAINT `fleet_aggregate_state_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `fleet_week_models` (
	`week` date NOT NULL,
	`camera_model_id` int NOT NULL,
	`mtf_bin` smallint NOT NULL,
	`checks` int NOT NULL DEFAULT 0,
	CONSTRAINT `fleet_week_models_week_camera_model_id_mtf_bin_pk` PRIMARY KEY(`week`,`camera_model_id`,`mtf_bin`)
);
--> statement-breakpoint
CREATE TABLE `fleet_week_sites` (
	`week` date NOT NULL,
	`site_id` int NOT NULL,
	`checks` int NOT NULL DEFAULT 0,
	`passed` int NOT NULL DEFAULT 0,
	`marginal` int NOT NULL DEFAULT 0,
	`failed` int NOT NULL DEFAULT 0,
	CONSTRAINT `fleet_week_sites_week_site_id_pk` PRIMARY KEY(`week`,`site_id`)
);
