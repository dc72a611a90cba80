-- Catalogue search: FTS5 over the LIVE copy's title, description, tags (occasions and blank) and the
-- shop name. Kept in step by triggers, so every write path (service, seed, tests) stays searchable.
-- Visibility (listing live, shop live) is decided by the query's join, not by this index, so a
-- suspended shop vanishes from search in the same transaction as the suspension.
-- Rows are keyed by listing_id, not by the listings table's implicit rowid, which VACUUM may renumber.
-- remove_diacritics 2: "Zoe" finds "Zoë". prefix '2 3': fast prefix queries ("pum*").
CREATE VIRTUAL TABLE `listings_fts` USING fts5(
  `listing_id` UNINDEXED, `title`, `description`, `tags`, `shop_name`,
  tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3'
);
--> statement-breakpoint
CREATE TRIGGER `listings_fts_ai` AFTER INSERT ON `listings` WHEN new.`live` IS NOT NULL BEGIN
  INSERT INTO `listings_fts` (`listing_id`, `title`, `description`, `tags`, `shop_name`)
  VALUES (new.`id`, new.`live_title`, coalesce(json_extract(new.`live`, '$.description'), ''),
    trim(replace(replace(coalesce(new.`live_occasions`, ''), ',', ' '), '-', ' ') || ' ' || replace(coalesce(new.`live_blank_kind`, ''), '_', ' ')),
    (SELECT `name` FROM `shops` WHERE `id` = new.`shop_id`));
END;
--> statement-breakpoint
CREATE TRIGGER `listings_fts_au` AFTER UPDATE OF `live`, `live_title`, `live_occasions`, `live_blank_kind`, `shop_id` ON `listings` BEGIN
  DELETE FROM `listings_fts` WHERE `listing_id` = old.`id`;
  INSERT INTO `listings_fts` (`listing_id`, `title`, `description`, `tags`, `shop_name`)
  SELECT new.`id`, new.`live_title`, coalesce(json_extract(new.`live`, '$.description'), ''),
    trim(replace(replace(coalesce(new.`live_occasions`, ''), ',', ' '), '-', ' ') || ' ' || replace(coalesce(new.`live_blank_kind`, ''), '_', ' ')),
    (SELECT `name` FROM `shops` WHERE `id` = new.`shop_id`)
  WHERE new.`live` IS NOT NULL;
END;
--> statement-breakpoint
CREATE TRIGGER `listings_fts_ad` AFTER DELETE ON `listings` BEGIN
  DELETE FROM `listings_fts` WHERE `listing_id` = old.`id`;
END;
--> statement-breakpoint
CREATE TRIGGER `listings_fts_shop_au` AFTER UPDATE OF `name` ON `shops` BEGIN
  UPDATE `listings_fts` SET `shop_name` = new.`name` WHERE `listing_id` IN (SELECT `id` FROM `listings` WHERE `shop_id` = new.`id`);
END;
