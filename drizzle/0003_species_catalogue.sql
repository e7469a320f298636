CREATE TABLE `catalogue_overrides` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`scientific_name` varchar(200) NOT NULL,
	`region` varchar(6) NOT NULL DEFAULT '',
	`field` varchar(40) NOT NULL,
	`value` json,
	`source` varchar(120) NOT NULL DEFAULT 'coordinator',
	`created_by` bigint unsigned,
	`created_at` timestamp(3) NOT NULL DEFAULT (now()),
	`updated_at` timestamp(3) NOT NULL DEFAULT (now()) ON UPDATE CURRENT_TIMESTAMP,
	CONSTRAINT `catalogue_overrides_id` PRIMARY KEY(`id`),
	CONSTRAINT `catalogue_overrides_unique` UNIQUE(`scientific_name`,`region`,`field`)
);
--> statement-breakpoint
CREATE TABLE `catalogue_regions` (
	`region` varchar(6) NOT NULL,
	`species_id` bigint unsigned NOT NULL,
	`status` enum('native','introduced','invasive','nativeAndIntroduced','absent') NOT NULL,
	`source` varchar(120) NOT NULL,
	CONSTRAINT `catalogue_regions_pk` PRIMARY KEY(`region`,`species_id`)
);
--> statement-breakpoint
CREATE TABLE `catalogue_species` (
	`id` bigint unsigned AUTO_INCREMENT NOT NULL,
	`scientific_name` varchar(200) NOT NULL,
	`common_name` varchar(200),
	`layer` enum('tree','shrub','ground') NOT NULL,
	`height_m` double NOT NULL,
	`spread_m` double NOT NULL,
	`sun` varchar(20) NOT NULL DEFAULT '',
	`moisture` varchar(20) NOT NULL DEFAULT '',
	`soil` varchar(20) NOT NULL DEFAULT '',
	`bloom_months` varchar(40) NOT NULL DEFAULT '',
	`min_zone` char(3),
	`min_zone_index` tinyint,
	`toxic` boolean NOT NULL DEFAULT false,
	`has_facts` boolean NOT NULL DEFAULT false,
	`origin` enum('usda','coordinator') NOT NULL DEFAULT 'usda',
	`data` json NOT NULL,
	CONSTRAINT `catalogue_species_id` PRIMARY KEY(`id`),
	CONSTRAINT `catalogue_species_name_unique` UNIQUE(`scientific_name`)
);
--> statement-breakpoint
ALTER TABLE `catalogue_overrides` ADD CONSTRAINT `catalogue_overrides_created_by_users_id_fk` FOREIGN KEY (`created_by`) REFERENCES `users`(`id`) ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE `catalogue_regions` ADD CONSTRAINT `catalogue_regions_species_id_catalogue_species_id_fk` FOREIGN KEY (`species_id`) REFERENCES `catalogue_species`(`id`) ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX `catalogue_overrides_region_idx` ON `catalogue_overrides` (`region`);--> statement-breakpoint
CREATE INDEX `catalogue_regions_species_idx` ON `catalogue_regions` (`species_id`);--> statement-breakpoint
CREATE INDEX `catalogue_regions_status_idx` ON `catalogue_regions` (`region`,`status`);--> statement-breakpoint
CREATE INDEX `catalogue_species_common_idx` ON `catalogue_species` (`common_name`);--> statement-breakpoint
CREATE INDEX `catalogue_species_layer_idx` ON `catalogue_species` (`layer`,`scientific_name`);