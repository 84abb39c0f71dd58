ALTER TABLE `stripe_events` ADD `subscription_id` varchar(80);--> statement-breakpoint
ALTER TABLE `stripe_events` ADD `subscription_status` varchar(32);--> statement-breakpoint
CREATE INDEX `stripe_events_subscription_idx` ON `stripe_events` (`workspace_id`,`subscription_id`);