CREATE TABLE `curve_points` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`curve_set_id` bigint unsigned NOT NULL,
	`seq` int NOT NULL,
	`flow` double NOT NULL,
	`head` double NOT NULL,
	`efficiency` double,
	`power` double,
	`npshr` double,
	CONSTRAINT `curve_points_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `curve_sets` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`model_id` bigint unsigned NOT NULL,
	`revision_id` bigint unsigned NOT NULL,
	`speed` double,
	`impeller_diameter` double,
	`flow_min` double NOT NULL,
	`flow_max` double NOT NULL,
	`head_max` double NOT NULL,
	`head_min` double NOT NULL,
	`point_count` int NOT NULL,
	CONSTRAINT `curve_sets_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `libraries` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`workspace_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`description` varchar(1000) NOT NULL DEFAULT '',
	`visibility` enum('private','workspace','shared') NOT NULL DEFAULT 'private',
	`current_revision_id` bigint unsigned,
	`mapping_json` text,
	`created_by` varchar(40),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `libraries_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `library_revisions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`library_id` bigint unsigned NOT NULL,
	`number` int NOT NULL,
	`upload_id` bigint unsigned,
	`note` varchar(500) NOT NULL DEFAULT '',
	`model_count` int NOT NULL DEFAULT 0,
	`curve_count` int NOT NULL DEFAULT 0,
	`point_count` int NOT NULL DEFAULT 0,
	`skipped_count` int NOT NULL DEFAULT 0,
	`created_by` varchar(40),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `library_revisions_id` PRIMARY KEY(`id`),
	CONSTRAINT `library_revisions_num_uq` UNIQUE(`library_id`,`number`)
);
--> statement-breakpoint
CREATE TABLE `pump_models` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`revision_id` bigint unsigned NOT NULL,
	`name` varchar(160) NOT NULL,
	`type` varchar(80) NOT NULL DEFAULT '',
	`nominal_size` varchar(60) NOT NULL DEFAULT '',
	`rated_speed` double,
	`impeller_min` double,
	`impeller_max` double,
	`notes` varchar(1000) NOT NULL DEFAULT '',
	CONSTRAINT `pump_models_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `uploads` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`library_id` bigint unsigned NOT NULL,
	`filename` varchar(255) NOT NULL,
	`size_bytes` int NOT NULL,
	`sha256` varchar(64) NOT NULL,
	`content` longblob NOT NULL,
	`created_by` varchar(40),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `uploads_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `curve_points` ADD CONSTRAINT `curve_points_curve_set_id_curve_sets_id_fk` FOREIGN KEY (`curve_set_id`) REFERENCES `curve_sets`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `curve_sets` ADD CONSTRAINT `curve_sets_model_id_pump_models_id_fk` FOREIGN KEY (`model_id`) REFERENCES `pump_models`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `curve_sets` ADD CONSTRAINT `curve_sets_revision_id_library_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `library_revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `libraries` ADD CONSTRAINT `libraries_workspace_id_workspaces_id_fk` FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `libraries` ADD CONSTRAINT `libraries_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `library_revisions` ADD CONSTRAINT `library_revisions_library_id_libraries_id_fk` FOREIGN KEY (`library_id`) REFERENCES `libraries`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `library_revisions` ADD CONSTRAINT `library_revisions_upload_id_uploads_id_fk` FOREIGN KEY (`upload_id`) REFERENCES `uploads`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `library_revisions` ADD CONSTRAINT `library_revisions_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `pump_models` ADD CONSTRAINT `pump_models_revision_id_library_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `library_revisions`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `uploads` ADD CONSTRAINT `uploads_library_id_libraries_id_fk` FOREIGN KEY (`library_id`) REFERENCES `libraries`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `uploads` ADD CONSTRAINT `uploads_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `curve_points_set_idx` ON `curve_points` (`curve_set_id`,`seq`);--> statement-breakpoint
CREATE INDEX `curve_sets_rev_idx` ON `curve_sets` (`revision_id`);--> statement-breakpoint
CREATE INDEX `curve_sets_model_idx` ON `curve_sets` (`model_id`);--> statement-breakpoint
CREATE INDEX `libraries_ws_idx` ON `libraries` (`workspace_id`);--> statement-breakpoint
CREATE INDEX `libraries_visibility_idx` ON `libraries` (`visibility`);--> statement-breakpoint
CREATE INDEX `pump_models_rev_idx` ON `pump_models` (`revision_id`);--> statement-breakpoint
CREATE INDEX `uploads_library_idx` ON `uploads` (`library_id`);