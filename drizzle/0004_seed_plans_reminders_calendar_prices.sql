CREATE TABLE `calendar_tokens` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`token_hash` char(64) NOT NULL,
	`revoked_at` timestamp(3),
	`last_used_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `calendar_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `calendar_tokens_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `seed_plans` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`margin` decimal(4,3) NOT NULL DEFAULT 0.2,
	`species` json NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `seed_plans_id` PRIMARY KEY(`id`),
	CONSTRAINT `seed_plans_yard_unique` UNIQUE(`yard_id`)
);
--> statement-breakpoint
CREATE TABLE `seed_prices` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`species_key` varchar(200) NOT NULL,
	`scientific_name` varchar(200) NOT NULL,
	`price_per_gram` decimal(10,4) NOT NULL,
	`set_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `seed_prices_id` PRIMARY KEY(`id`),
	CONSTRAINT `seed_prices_species_unique` UNIQUE(`species_key`)
);
--> statement-breakpoint
CREATE TABLE `seed_reminder_subscriptions` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`enabled` boolean NOT NULL DEFAULT true,
	`unsubscribe_token` varchar(64) NOT NULL,
	`lead_days` int unsigned NOT NULL DEFAULT 3,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `seed_reminder_subscriptions_id` PRIMARY KEY(`id`),
	CONSTRAINT `seed_reminder_subscriptions_user_yard_unique` UNIQUE(`user_id`,`yard_id`),
	CONSTRAINT `seed_reminder_subscriptions_token_unique` UNIQUE(`unsubscribe_token`)
);
--> statement-breakpoint
ALTER TABLE `calendar_tokens` ADD CONSTRAINT `calendar_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `seed_plans` ADD CONSTRAINT `seed_plans_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `seed_prices` ADD CONSTRAINT `seed_prices_set_by_users_id_fk` FOREIGN KEY (`set_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `seed_reminder_subscriptions` ADD CONSTRAINT `seed_reminder_subscriptions_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `seed_reminder_subscriptions` ADD CONSTRAINT `seed_reminder_subscriptions_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `calendar_tokens_user_idx` ON `calendar_tokens` (`user_id`);--> statement-breakpoint
CREATE INDEX `seed_reminder_subscriptions_yard_idx` ON `seed_reminder_subscriptions` (`yard_id`);