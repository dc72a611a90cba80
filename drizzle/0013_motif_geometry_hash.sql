ALTER TABLE `motifs` ADD `geometry_hash` text;--> statement-breakpoint
CREATE INDEX `motifs_geometry_hash_idx` ON `motifs` (`geometry_hash`);