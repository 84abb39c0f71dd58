CREATE TABLE `trace_pictures` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`library_id` bigint unsigned NOT NULL,
	`filename` varchar(255) NOT NULL,
	`content_type` varchar(60) NOT NULL,
	`size_bytes` int NOT NULL,
	`sha256` varchar(64) NOT NULL,
	`content` longblob NOT NULL,
	`created_by` varchar(40),
	`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
	CONSTRAINT `trace_pictures_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `uploads` ADD `source` varchar(300);--> statement-breakpoint
ALTER TABLE `uploads` ADD `trace_picture_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `trace_pictures` ADD CONSTRAINT `trace_pictures_library_id_libraries_id_fk` FOREIGN KEY (`library_id`) REFERENCES `libraries`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `trace_pictures` ADD CONSTRAINT `trace_pictures_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `trace_pictures_library_idx` ON `trace_pictures` (`library_id`);--> statement-breakpoint
ALTER TABLE `uploads` ADD CONSTRAINT `uploads_trace_picture_id_trace_pictures_id_fk` FOREIGN KEY (`trace_picture_id`) REFERENCES `trace_pictures`(`id`) ON DELETE set null ON UPDATE no action;