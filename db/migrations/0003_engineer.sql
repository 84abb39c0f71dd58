CREATE TABLE `candidates` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`system_id` bigint unsigned NOT NULL,
	`curve_set_id` bigint unsigned NOT NULL,
	`adjustment_json` text NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `candidates_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `projects` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`workspace_id` bigint unsigned NOT NULL,
	`name` varchar(160) NOT NULL,
	`site` varchar(200) NOT NULL DEFAULT '',
	`description` varchar(2000) NOT NULL DEFAULT '',
	`archived_at` datetime,
	`created_by` varchar(40),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `projects_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `rate_limits` (
	`bucket` varchar(120) NOT NULL,
	`window_start` datetime NOT NULL,
	`hits` int NOT NULL DEFAULT 0,
	CONSTRAINT `rate_limits_pk` PRIMARY KEY(`bucket`,`window_start`)
);
--> statement-breakpoint
CREATE TABLE `selections` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`system_id` bigint unsigned NOT NULL,
	`project_id` bigint unsigned NOT NULL,
	`workspace_id` bigint unsigned NOT NULL,
	`curve_set_id` bigint unsigned,
	`revision_id` bigint unsigned,
	`title` varchar(200) NOT NULL,
	`note` varchar(2000) NOT NULL DEFAULT '',
	`frozen_json` mediumtext NOT NULL,
	`created_by` varchar(40),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `selections_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `systems` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`project_id` bigint unsigned NOT NULL,
	`workspace_id` bigint unsigned NOT NULL,
	`name` varchar(160) NOT NULL,
	`input_json` text NOT NULL,
	`archived_at` datetime,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `systems_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `candidates` ADD CONSTRAINT `candidates_system_id_systems_id_fk` FOREIGN KEY (`system_id`) REFERENCES `systems`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `candidates` ADD CONSTRAINT `candidates_curve_set_id_curve_sets_id_fk` FOREIGN KEY (`curve_set_id`) REFERENCES `curve_sets`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `projects` ADD CONSTRAINT `projects_workspace_id_workspaces_id_fk` FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `projects` ADD CONSTRAINT `projects_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `selections` ADD CONSTRAINT `selections_system_id_systems_id_fk` FOREIGN KEY (`system_id`) REFERENCES `systems`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `selections` ADD CONSTRAINT `selections_project_id_projects_id_fk` FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `selections` ADD CONSTRAINT `selections_workspace_id_workspaces_id_fk` FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `selections` ADD CONSTRAINT `selections_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `systems` ADD CONSTRAINT `systems_project_id_projects_id_fk` FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `systems` ADD CONSTRAINT `systems_workspace_id_workspaces_id_fk` FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `candidates_system_idx` ON `candidates` (`system_id`);--> statement-breakpoint
CREATE INDEX `projects_ws_idx` ON `projects` (`workspace_id`);--> statement-breakpoint
CREATE INDEX `selections_system_idx` ON `selections` (`system_id`);--> statement-breakpoint
CREATE INDEX `selections_ws_idx` ON `selections` (`workspace_id`);--> statement-breakpoint
CREATE INDEX `systems_project_idx` ON `systems` (`project_id`);--> statement-breakpoint
CREATE INDEX `systems_ws_idx` ON `systems` (`workspace_id`);