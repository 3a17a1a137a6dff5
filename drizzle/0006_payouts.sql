CREATE TABLE `payment_event` (
	`id` varchar(64) NOT NULL,
	`type` varchar(64) NOT NULL,
	`outcome` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `payment_event_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `payout_account` (
	`user_id` varchar(255) NOT NULL,
	`provider_account_id` varchar(64) NOT NULL,
	`details_submitted` boolean NOT NULL DEFAULT false,
	`transfers_active` boolean NOT NULL DEFAULT false,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `payout_account_user_id` PRIMARY KEY(`user_id`),
	CONSTRAINT `payout_account_provider_account_id_unique` UNIQUE(`provider_account_id`)
);
--> statement-breakpoint
CREATE TABLE `payout_period` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`label` varchar(80) NOT NULL,
	`starts_on` datetime NOT NULL,
	`ends_on` datetime NOT NULL,
	`computation` json,
	`closed_at` datetime(3),
	`closed_by` varchar(255),
	`created_at` datetime(3) NOT NULL,
	CONSTRAINT `payout_period_id` PRIMARY KEY(`id`),
	CONSTRAINT `payout_period_label` UNIQUE(`anthology_id`,`label`)
);
--> statement-breakpoint
CREATE TABLE `payout_transfer` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`anthology_id` bigint unsigned NOT NULL,
	`entry_id` bigint unsigned NOT NULL,
	`attempt` int NOT NULL,
	`idempotency_key` varchar(64) NOT NULL,
	`provider_transfer_id` varchar(64),
	`destination` varchar(64) NOT NULL,
	`amount_cents` bigint NOT NULL,
	`currency` char(3) NOT NULL,
	`state` varchar(16) NOT NULL,
	`error` varchar(500),
	`created_by` varchar(255) NOT NULL,
	`created_at` datetime(3) NOT NULL,
	`updated_at` datetime(3) NOT NULL,
	CONSTRAINT `payout_transfer_id` PRIMARY KEY(`id`),
	CONSTRAINT `payout_transfer_idempotency_key_unique` UNIQUE(`idempotency_key`),
	CONSTRAINT `payout_transfer_provider_transfer_id_unique` UNIQUE(`provider_transfer_id`),
	CONSTRAINT `payout_transfer_attempt` UNIQUE(`entry_id`,`attempt`)
);
--> statement-breakpoint
ALTER TABLE `payout_entry` MODIFY COLUMN `kind` varchar(16) NOT NULL;--> statement-breakpoint
ALTER TABLE `open_call` ADD `share_split` varchar(16) DEFAULT 'per-page' NOT NULL;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD `period_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD `source` varchar(16) NOT NULL;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD `settles_entry_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD `reverses_entry_id` bigint unsigned;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD `computation` json NOT NULL;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD `reference` varchar(120);--> statement-breakpoint
ALTER TABLE `payout_entry` ADD `dedupe_key` varchar(191) NOT NULL;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD `created_by` varchar(255);--> statement-breakpoint
ALTER TABLE `sale` ADD `channel` varchar(16) NOT NULL;--> statement-breakpoint
ALTER TABLE `sale` ADD `unit_price_cents` bigint NOT NULL;--> statement-breakpoint
ALTER TABLE `sale` ADD `discount_cents` bigint DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `sale` ADD `channel_fees_cents` bigint DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `sale` ADD `recoverable_costs_cents` bigint DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `sale` ADD `currency` char(3) NOT NULL;--> statement-breakpoint
ALTER TABLE `sale` ADD `note` varchar(255);--> statement-breakpoint
ALTER TABLE `sale` ADD `recorded_by` varchar(255) NOT NULL;--> statement-breakpoint
ALTER TABLE `sale` ADD `created_at` datetime(3) NOT NULL;--> statement-breakpoint
ALTER TABLE `payout_entry` ADD CONSTRAINT `payout_entry_dedupe_key_unique` UNIQUE(`dedupe_key`);--> statement-breakpoint
ALTER TABLE `payout_account` ADD CONSTRAINT `payout_account_user_id_user_id_fk` FOREIGN KEY (`user_id`) REFERENCES `user`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `payout_period` ADD CONSTRAINT `payout_period_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `payout_transfer` ADD CONSTRAINT `payout_transfer_anthology_id_anthology_id_fk` FOREIGN KEY (`anthology_id`) REFERENCES `anthology`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `sale_anthology` ON `sale` (`anthology_id`,`sold_on`);--> statement-breakpoint
ALTER TABLE `payout_entry` DROP COLUMN `state`;--> statement-breakpoint
ALTER TABLE `payout_entry` DROP COLUMN `memo`;--> statement-breakpoint
ALTER TABLE `sale` DROP COLUMN `gross_cents`;--> statement-breakpoint
ALTER TABLE `sale` DROP COLUMN `costs_cents`;