ALTER TABLE `project_shares` ADD `state` enum('pending','accepted','declined') DEFAULT 'pending' NOT NULL;--> statement-breakpoint
ALTER TABLE `project_shares` ADD `decided_by` varchar(40);--> statement-breakpoint
ALTER TABLE `project_shares` ADD `decided_at` datetime(3);--> statement-breakpoint
ALTER TABLE `project_shares` ADD CONSTRAINT `project_shares_decided_by_users_id_fk` FOREIGN KEY (`decided_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
-- Data: shares made before consent existed opened the project to their workspace the moment they were made, so they stay
-- open, as accepted (decided_by and decided_at left null: nobody of that workspace decided). A share made from now on starts
-- pending (the column's default) until an admin of the receiving workspace accepts it. Decision "shareconsent" in DEVELOPERS.md.
UPDATE `project_shares` SET `state` = 'accepted';
