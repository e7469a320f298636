CREATE TABLE `donations` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`amount_minor` int unsigned NOT NULL,
	`currency` char(3) NOT NULL,
	`dedication` varchar(200),
	`status` enum('awaiting_payment','paid','cancelled','refunded') NOT NULL DEFAULT 'awaiting_payment',
	`checkout_session_id` varchar(255),
	`payment_intent_id` varchar(255),
	`paid_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `donations_id` PRIMARY KEY(`id`),
	CONSTRAINT `donations_session_unique` UNIQUE(`checkout_session_id`)
);
--> statement-breakpoint
CREATE TABLE `payment_events` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`event_id` varchar(255) NOT NULL,
	`type` varchar(80) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `payment_events_id` PRIMARY KEY(`id`),
	CONSTRAINT `payment_events_event_unique` UNIQUE(`event_id`)
);
--> statement-breakpoint
CREATE TABLE `pickup_events` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`sale_id` bigint unsigned NOT NULL,
	`starts_at` datetime NOT NULL,
	`place` varchar(200) NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `pickup_events_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `sale_order_items` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`order_id` bigint unsigned NOT NULL,
	`lot_id` bigint unsigned NOT NULL,
	`quantity` int unsigned NOT NULL,
	`unit_price_minor` int unsigned NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `sale_order_items_id` PRIMARY KEY(`id`),
	CONSTRAINT `sale_order_items_order_lot_unique` UNIQUE(`order_id`,`lot_id`)
);
--> statement-breakpoint
CREATE TABLE `sale_orders` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`user_id` bigint unsigned NOT NULL,
	`sale_id` bigint unsigned NOT NULL,
	`status` enum('cart','awaiting_payment','paid','packed','picked_up','sent','cancelled','refunded') NOT NULL DEFAULT 'cart',
	`delivery` enum('pickup','mail'),
	`pickup_event_id` bigint unsigned,
	`mailing_address` text,
	`payment` enum('card','at_pickup'),
	`currency` char(3) NOT NULL,
	`subtotal_minor` int unsigned NOT NULL DEFAULT 0,
	`delivery_fee_minor` int unsigned NOT NULL DEFAULT 0,
	`total_minor` int unsigned NOT NULL DEFAULT 0,
	`stock_held` boolean NOT NULL DEFAULT false,
	`checkout_session_id` varchar(255),
	`payment_intent_id` varchar(255),
	`placed_at` timestamp(3),
	`paid_at` timestamp(3),
	`closed_at` timestamp(3),
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `sale_orders_id` PRIMARY KEY(`id`),
	CONSTRAINT `sale_orders_session_unique` UNIQUE(`checkout_session_id`)
);
--> statement-breakpoint
CREATE TABLE `seed_lots` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`sale_id` bigint unsigned NOT NULL,
	`species_key` varchar(200) NOT NULL,
	`scientific_name` varchar(200) NOT NULL,
	`collected` varchar(200) NOT NULL,
	`seeds_per_packet` int unsigned,
	`packet_milligrams` int unsigned,
	`price_minor` int unsigned NOT NULL,
	`stock` int unsigned NOT NULL,
	`growing_notes` text,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `seed_lots_id` PRIMARY KEY(`id`),
	CONSTRAINT `seed_lots_sale_species_collected_unique` UNIQUE(`sale_id`,`species_key`,`collected`)
);
--> statement-breakpoint
CREATE TABLE `seed_sales` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`name` varchar(160) NOT NULL,
	`opens_on` date NOT NULL,
	`closes_on` date NOT NULL,
	`paused` boolean NOT NULL DEFAULT false,
	`currency` char(3) NOT NULL DEFAULT 'usd',
	`mail_enabled` boolean NOT NULL DEFAULT false,
	`mail_fee_minor` int unsigned NOT NULL DEFAULT 0,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `seed_sales_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
CREATE TABLE `thank_you_templates` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`subject` varchar(200) NOT NULL,
	`body` text NOT NULL,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `thank_you_templates_id` PRIMARY KEY(`id`)
);
--> statement-breakpoint
ALTER TABLE `donations` ADD CONSTRAINT `donations_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `pickup_events` ADD CONSTRAINT `pickup_events_sale_id_seed_sales_id_fk` FOREIGN KEY (`sale_id`) REFERENCES `seed_sales`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sale_order_items` ADD CONSTRAINT `sale_order_items_order_id_sale_orders_id_fk` FOREIGN KEY (`order_id`) REFERENCES `sale_orders`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sale_order_items` ADD CONSTRAINT `sale_order_items_lot_id_seed_lots_id_fk` FOREIGN KEY (`lot_id`) REFERENCES `seed_lots`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sale_orders` ADD CONSTRAINT `sale_orders_user_id_users_id_fk` FOREIGN KEY (`user_id`) REFERENCES `users`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sale_orders` ADD CONSTRAINT `sale_orders_sale_id_seed_sales_id_fk` FOREIGN KEY (`sale_id`) REFERENCES `seed_sales`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `sale_orders` ADD CONSTRAINT `sale_orders_pickup_event_id_pickup_events_id_fk` FOREIGN KEY (`pickup_event_id`) REFERENCES `pickup_events`(`id`) ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `seed_lots` ADD CONSTRAINT `seed_lots_sale_id_seed_sales_id_fk` FOREIGN KEY (`sale_id`) REFERENCES `seed_sales`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `donations_user_idx` ON `donations` (`user_id`);--> statement-breakpoint
CREATE INDEX `donations_paid_idx` ON `donations` (`status`,`paid_at`);--> statement-breakpoint
CREATE INDEX `pickup_events_sale_idx` ON `pickup_events` (`sale_id`,`starts_at`);--> statement-breakpoint
CREATE INDEX `sale_order_items_lot_idx` ON `sale_order_items` (`lot_id`);--> statement-breakpoint
CREATE INDEX `sale_orders_user_idx` ON `sale_orders` (`user_id`,`status`);--> statement-breakpoint
CREATE INDEX `sale_orders_sale_status_idx` ON `sale_orders` (`sale_id`,`status`);--> statement-breakpoint
CREATE INDEX `sale_orders_payment_intent_idx` ON `sale_orders` (`payment_intent_id`);--> statement-breakpoint
CREATE INDEX `seed_sales_dates_idx` ON `seed_sales` (`opens_on`,`closes_on`);