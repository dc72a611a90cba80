CREATE TABLE `refund_intents` (
	`id` text PRIMARY KEY NOT NULL,
	`order_id` text NOT NULL,
	`line_id` text,
	`scope` text NOT NULL,
	`idempotency_key` text NOT NULL,
	`amount_minor` integer NOT NULL,
	`state` text DEFAULT 'pending' NOT NULL,
	`provider_refund_id` text,
	`actor_id` text NOT NULL,
	`reason` text,
	`error` text,
	`created_at` integer NOT NULL,
	`updated_at` integer NOT NULL,
	FOREIGN KEY (`order_id`) REFERENCES `orders`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`line_id`) REFERENCES `order_lines`(`id`) ON UPDATE no action ON DELETE no action,
	FOREIGN KEY (`actor_id`) REFERENCES `user`(`id`) ON UPDATE no action ON DELETE no action
);
--> statement-breakpoint
CREATE UNIQUE INDEX `refund_intents_key_uq` ON `refund_intents` (`idempotency_key`);--> statement-breakpoint
CREATE UNIQUE INDEX `refund_intents_live_uq` ON `refund_intents` (`order_id`,`scope`) WHERE state <> 'failed';--> statement-breakpoint
ALTER TABLE `orders` ADD `payout_step` text;--> statement-breakpoint
ALTER TABLE `orders` ADD `payout_seq` integer DEFAULT 0 NOT NULL;