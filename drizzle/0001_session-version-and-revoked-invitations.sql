ALTER TABLE `invitation` ADD `revoked_at` datetime;--> statement-breakpoint
ALTER TABLE `invitation` ADD `revoked_by` varchar(255);--> statement-breakpoint
ALTER TABLE `user` ADD `session_version` int DEFAULT 0 NOT NULL;