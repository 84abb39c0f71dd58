ALTER TABLE `field_checks` ADD `client_id` varchar(64);--> statement-breakpoint
ALTER TABLE `field_checks` ADD CONSTRAINT `field_checks_client_uq` UNIQUE(`client_id`);