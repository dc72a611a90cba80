ALTER TABLE `listings` ADD `revision` integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE `shops` ADD `pending_change` text;--> statement-breakpoint
ALTER TABLE `shops` ADD `change_revision` integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE `shops` ADD `change_rejection_reason` text;