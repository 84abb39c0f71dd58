CREATE TABLE `field_check_photos` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`field_check_id` bigint unsigned NOT NULL,
	`filename` varchar(255) NOT NULL,
	`content_type` varchar(60) NOT NULL,
	`size_bytes` int NOT NULL,
	`sha256` varchar(64) NOT NULL,
	`content` longblob NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `field_check_photos_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `field_checks` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`selection_id` bigint unsigned NOT NULL,
	`chain_id` bigint unsigned,
	`version` int NOT NULL DEFAULT 1,
	`workspace_id` bigint unsigned NOT NULL,
	`created_by` varchar(40),
	`readings_json` mediumtext NOT NULL,
	`result_json` mediumtext NOT NULL,
	`verdict` enum('pass','marginal','fail','unknown') NOT NULL,
	`grade` varchar(20) NOT NULL,
	`notes` text NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `field_checks_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `project_shares` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`project_id` bigint unsigned NOT NULL,
	`workspace_id` bigint unsigned NOT NULL,
	`created_by` varchar(40),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `project_shares_id` PRIMARY KEY(`id`),
	CONSTRAINT `project_shares_uq` UNIQUE(`project_id`,`workspace_id`)
);
--> statement-breakpoint
CREATE TABLE `stripe_events` (
	`id` varchar(80) NOT NULL,
	`type` varchar(80) NOT NULL,
	`workspace_id` bigint unsigned,
	`event_created_at` datetime NOT NULL,
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `stripe_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `workspaces` ADD `stripe_customer_id` varchar(64);--> statement-breakpoint
ALTER TABLE `workspaces` ADD `stripe_subscription_id` varchar(64);--> statement-breakpoint
ALTER TABLE `workspaces` ADD `subscription_status` varchar(32);--> statement-breakpoint
ALTER TABLE `workspaces` ADD `current_period_end` datetime;--> statement-breakpoint
ALTER TABLE `workspaces` ADD `cancel_at_period_end` boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `workspaces` ADD CONSTRAINT `workspaces_stripe_customer_uq` UNIQUE(`stripe_customer_id`);--> statement-breakpoint
ALTER TABLE `field_check_photos` ADD CONSTRAINT `field_check_photos_field_check_id_field_checks_id_fk` FOREIGN KEY (`field_check_id`) REFERENCES `field_checks`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `field_checks` ADD CONSTRAINT `field_checks_selection_id_selections_id_fk` FOREIGN KEY (`selection_id`) REFERENCES `selections`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `field_checks` ADD CONSTRAINT `field_checks_workspace_id_workspaces_id_fk` FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `field_checks` ADD CONSTRAINT `field_checks_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `project_shares` ADD CONSTRAINT `project_shares_project_id_projects_id_fk` FOREIGN KEY (`project_id`) REFERENCES `projects`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `project_shares` ADD CONSTRAINT `project_shares_workspace_id_workspaces_id_fk` FOREIGN KEY (`workspace_id`) REFERENCES `workspaces`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `project_shares` ADD CONSTRAINT `project_shares_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `field_check_photos_check_idx` ON `field_check_photos` (`field_check_id`);--> statement-breakpoint
CREATE INDEX `field_checks_selection_idx` ON `field_checks` (`selection_id`);--> statement-breakpoint
CREATE INDEX `field_checks_chain_idx` ON `field_checks` (`chain_id`);