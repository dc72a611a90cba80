CREATE TABLE `blank_stock` (
	`blank_type_id` text NOT NULL,
	`size_id` text NOT NULL,
	`colour_id` text NOT NULL,
	`quantity` integer DEFAULT 0 NOT NULL,
	`low_stock` integer DEFAULT 3 NOT NULL,
	FOREIGN KEY (`blank_type_id`) REFERENCES `blank_types`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE UNIQUE INDEX `blank_stock_uq` ON `blank_stock` (`blank_type_id`,`size_id`,`colour_id`);--> statement-breakpoint
CREATE TABLE `blank_types` (
	`id` text PRIMARY KEY NOT NULL,
	`shop_id` text NOT NULL,
	`name` text NOT NULL,
	`shape` text NOT NULL,
	`sizes` text NOT NULL,
	`colours` text NOT NULL,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON UPDATE no action ON DELETE cascade
);
--> statement-breakpoint
CREATE INDEX `blank_types_shop_idx` ON `blank_types` (`shop_id`);--> statement-breakpoint
CREATE TABLE `stock_holds` (
	`id` text PRIMARY KEY NOT NULL,
	`checkout_id` text NOT NULL,
	`blank_type_id` text NOT NULL,
	`size_id` text NOT NULL,
	`colour_id` text NOT NULL,
	`quantity` integer NOT NULL,
	`state` text DEFAULT 'held' NOT NULL,
	`created_at` integer NOT NULL
);
--> statement-breakpoint
CREATE INDEX `stock_holds_checkout_idx` ON `stock_holds` (`checkout_id`);