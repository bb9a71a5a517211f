ALTER TABLE `analyses` MODIFY COLUMN `worst_margin_db` double;--> statement-breakpoint
UPDATE `analyses` SET `worst_margin_db` = CAST(LEAST(
        COALESCE(JSON_VALUE(result_json, '$.figures.mask.upper.worstMarginDb'), JSON_VALUE(result_json, '$.figures.mask.lower.worstMarginDb')),
        COALESCE(JSON_VALUE(result_json, '$.figures.mask.lower.worstMarginDb'), JSON_VALUE(result_json, '$.figures.mask.upper.worstMarginDb'))
      ) AS DOUBLE) WHERE `worst_margin_db` IS NULL AND `result_json` IS NOT NULL;
