ALTER TABLE `carts` ADD `version` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `checkouts` ADD `cart_version` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `checkouts` ADD `charge_id` text;--> statement-breakpoint
ALTER TABLE `checkouts` ADD `mailed_at` integer;--> statement-breakpoint
CREATE UNIQUE INDEX `checkouts_cart_version_uq` ON `checkouts` (`cart_id`,`cart_version`);