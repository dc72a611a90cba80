ALTER TABLE `listings` ADD `live_thumb_path` text;--> statement-breakpoint
CREATE INDEX `listings_catalog_idx` ON `listings` (`state`,`published_at`);