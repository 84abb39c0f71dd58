CREATE TABLE `imports` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`library_id` bigint unsigned NOT NULL,
	`upload_id` bigint unsigned,
	`status` varchar(12) NOT NULL DEFAULT 'running',
	`points_total` int NOT NULL DEFAULT 0,
	`points_written` int NOT NULL DEFAULT 0,
	`revision_id` bigint unsigned,
	`revision_number` int,
	`message` varchar(500) NOT NULL DEFAULT '',
	`created_by` varchar(40),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	`updated_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `imports_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `candidates` ADD `purchase_price_cents` bigint unsigned;--> statement-breakpoint
ALTER TABLE `field_checks` ADD `client_id` varchar(64);--> statement-breakpoint
ALTER TABLE `field_checks` ADD CONSTRAINT `field_checks_client_uq` UNIQUE(`client_id`);--> statement-breakpoint
ALTER TABLE `imports` ADD CONSTRAINT `imports_library_id_libraries_id_fk` FOREIGN KEY (`library_id`) REFERENCES `libraries`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `imports` ADD CONSTRAINT `imports_upload_id_uploads_id_fk` FOREIGN KEY (`upload_id`) REFERENCES `uploads`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `imports` ADD CONSTRAINT `imports_revision_id_library_revisions_id_fk` FOREIGN KEY (`revision_id`) REFERENCES `library_revisions`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `imports` ADD CONSTRAINT `imports_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `imports_library_idx` ON `imports` (`library_id`,`id`);