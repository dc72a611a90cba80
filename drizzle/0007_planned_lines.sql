-- Lines already on a cut sheet that is not cut yet become `planned` (the line state that keeps
-- them from being built onto a second batch); their timeline gets the move.
INSERT INTO `line_events` (`id`, `line_id`, `actor_id`, `from_state`, `to_state`, `message`, `created_at`)
SELECT lower(hex(randomblob(16))), `id`, NULL, 'approved', 'planned', 'On a cut sheet that is not cut yet.', CAST((julianday('now') - 2440587.5) * 86400000 AS INTEGER)
FROM `order_lines`
WHERE `state` = 'approved' AND `id` IN (
  SELECT json_extract(p.value, '$.lineId') FROM `cut_sheets` s, json_each(s.`pieces`) p WHERE s.`state` <> 'cut'
);
--> statement-breakpoint
UPDATE `order_lines` SET `state` = 'planned'
WHERE `state` = 'approved' AND `id` IN (
  SELECT json_extract(p.value, '$.lineId') FROM `cut_sheets` s, json_each(s.`pieces`) p WHERE s.`state` <> 'cut'
);
