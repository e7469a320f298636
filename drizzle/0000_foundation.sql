CREATE TABLE `login_failures` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`address` varchar(64) NOT NULL,
	`at` timestamp(3) NOT NULL DEFAULT (now()),
	CONSTRAINT `login_failures_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `password_reset_tokens` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`token_hash` char(64) NOT NULL,
	`expires_at` timestamp(3) NOT NULL,
	`used_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `password_reset_tokens_id` PRIMARY KEY(`id`),
	CONSTRAINT `password_reset_tokens_hash_unique` UNIQUE(`token_hash`)
);
--> statement-breakpoint
CREATE TABLE `users` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`email` varchar(254) NOT NULL,
	`name` varchar(120) NOT NULL,
	`password_hash` varchar(255) NOT NULL,
	`role` enum('homeowner','advisor','coordinator') NOT NULL DEFAULT 'homeowner',
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `users_id` PRIMARY KEY(`id`),
	CONSTRAINT `users_email_unique` UNIQUE(`email`)
);
--> statement-breakpoint
CREATE TABLE `yard_members` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`yard_id` bigint unsigned NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`role` enum('viewer','editor') NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `yard_members_id` PRIMARY KEY(`id`),
	CONSTRAINT `yard_members_yard_user_unique` UNIQUE(`yard_id`,`user_id`)
);
--> statement-breakpoint
CREATE TABLE `yards` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`owner_id` bigint unsigned NOT NULL,
	`name` varchar(120) NOT NULL,
	`region` varchar(6) NOT NULL,
	`zone` varchar(3),
	`last_spring_frost` char(5),
	`first_fall_frost` char(5),
	`units` enum('ft','m') NOT NULL DEFAULT 'ft',
	`document` json NOT NULL,
	`version` int unsigned NOT NULL DEFAULT 1,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `yards_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `app_meta` (
	`key` varchar(64) NOT NULL,
	`value` json,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `app_meta_key` PRIMARY KEY(`key`)
);
--> statement-breakpoint
CREATE TABLE `organisation` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(160) NOT NULL,
	`goal` decimal(4,3) NOT NULL DEFAULT 0.7,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `organisation_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `password_reset_tokens` ADD CONSTRAINT `password_reset_tokens_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `yard_members` ADD CONSTRAINT `yard_members_yard_id_yards_id_fk` FOREIGN KEY (`yard_id`) REFERENCES `yards`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `yard_members` ADD CONSTRAINT `yard_members_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `yards` ADD CONSTRAINT `yards_owner_id_users_id_fk` FOREIGN KEY (`owner_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `login_failures_email_idx` ON `login_failures` (`email`,`at`);--> statement-breakpoint
CREATE INDEX `login_failures_address_idx` ON `login_failures` (`address`,`at`);--> statement-breakpoint
CREATE INDEX `password_reset_tokens_user_idx` ON `password_reset_tokens` (`user_id`);--> statement-breakpoint
CREATE INDEX `yard_members_user_idx` ON `yard_members` (`user_id`);--> statement-breakpoint
CREATE INDEX `yards_owner_idx` ON `yards` (`owner_id`);