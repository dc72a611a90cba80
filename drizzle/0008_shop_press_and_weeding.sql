ALTER TABLE `shops` ADD `back_press` integer DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE `shops` ADD `weeding_rates` text;