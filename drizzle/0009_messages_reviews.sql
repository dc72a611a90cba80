CREATE TABLE `order_messages` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`author_id` text NOT NULL,
	`side` text NOT NULL,
	`body` text NOT NULL,
	`photo_path` text,
	`photo_thumb_path` text,
	`photo_width` integer,
	`photo_height` integer,
	`shopper_read_at` integer,
	`shop_read_at` integer,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE INDEX `order_messages_order_idx` ON `order_messages` (`order_id`,`created_at`);--> statement-breakpoint
CREATE TABLE `reviews` (
	`id` text PRIMARY KEY NOT NULL,
	`line_id` text NOT NULL,
	`order_id` text NOT NULL,
	`listing_id` text NOT NULL,
	`shop_id` text NOT NULL,
	`author_id` text NOT NULL,
	`rating` integer NOT NULL,
	`body` text NOT NULL,
	`photo_path` text,
	`photo_thumb_path` text,
	`photo_width` integer,
	`photo_height` integer,
	`reply` text,
	`replied_at` integer,
	`hidden_at` integer,
	`hidden_reason` text,
	`created_at` integer NOT NULL,
	FOREIGN KEY (`line_id`) REFERENCES `order_lines`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE cascade,
	FOREIGN KEY (`listing_id`) REFERENCES `listings`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`shop_id`) REFERENCES `shops`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`author_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `reviews_line_uq` ON `reviews` (`line_id`);--> statement-breakpoint
CREATE INDEX `reviews_listing_idx` ON `reviews` (`listing_id`,`created_at`);--> statement-breakpoint
CREATE INDEX `reviews_shop_idx` ON `reviews` (`shop_id`,`created_at`);