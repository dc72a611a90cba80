CREATE TABLE `cart_shop_choices` (
	`cart_id` text NOT NULL,
	`shop_id` text NOT NULL,
	`code` text,
	`needed_by` text,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`cart_id`) REFERENCES `carts`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `cart_shop_choices_uq` ON `cart_shop_choices` (`cart_id`,`shop_id`);--> statement-breakpoint
CREATE TABLE `discount_codes` (
	`id` text PRIMARY KEY NOT NULL,
	`shop_id` text NOT NULL,
	`code` text NOT NULL,
	`kind` text NOT NULL,
	`value` integer NOT NULL,
	`min_spend_minor` integer DEFAULT 0 NOT NULL,
	`starts_on` text,
	`ends_on` text,
	`usage_limit` integer,
	`listing_ids` text,
	`active` integer DEFAULT true NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `discount_codes_shop_code_uq` ON `discount_codes` (`shop_id`,`code`);--> statement-breakpoint
CREATE TABLE `discount_uses` (
	`id` text PRIMARY KEY NOT NULL,
	`code_id` text NOT NULL,
	`checkout_id` text NOT NULL,
	`state` text DEFAULT 'reserved' NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`code_id`) REFERENCES `discount_codes`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`checkout_id`) REFERENCES `checkouts`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `discount_uses_code_checkout_uq` ON `discount_uses` (`code_id`,`checkout_id`);--> statement-breakpoint
CREATE INDEX `discount_uses_code_idx` ON `discount_uses` (`code_id`,`state`);--> statement-breakpoint
CREATE TABLE `order_by_dates` (
	`id` text PRIMARY KEY NOT NULL,
	`shop_id` text NOT NULL,
	`occasion` text NOT NULL,
	`order_by` text NOT NULL,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `order_by_dates_shop_idx` ON `order_by_dates` (`shop_id`,`order_by`);--> statement-breakpoint
ALTER TABLE `order_lines` ADD `discount_minor` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `orders` ADD `needed_by` text;--> statement-breakpoint
ALTER TABLE `orders` ADD `discount_minor` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `orders` ADD `discount_code` text;--> statement-breakpoint
ALTER TABLE `shops` ADD `shipping_days` integer DEFAULT 3 NOT NULL;