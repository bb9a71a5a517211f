ALTER TABLE `analyses` ADD `worst_margin_db` double GENERATED ALWAYS AS (CAST(LEAST(
        COALESCE(JSON_VALUE(result_json, '$.figures.mask.upper.worstMarginDb'), JSON_VALUE(result_json, '$.figures.mask.lower.worstMarginDb')),
        COALESCE(JSON_VALUE(result_json, '$.figures.mask.lower.worstMarginDb'), JSON_VALUE(result_json, '$.figures.mask.upper.worstMarginDb'))
      ) AS DOUBLE)) STORED;--> statement-breakpoint
CREATE INDEX `analyses_organisation_model_idx` ON `analyses` (`organisation_id`,`dut_model`,`id`);--> statement-breakpoint
CREATE INDEX `analyses_organisation_serial_idx` ON `analyses` (`organisation_id`,`dut_serial`,`id`);--> statement-breakpoint
CREATE INDEX `analyses_organisation_verdict_idx` ON `analyses` (`organisation_id`,`verdict`,`id`);--> statement-breakpoint
CREATE INDEX `analyses_organisation_margin_idx` ON `analyses` (`organisation_id`,`worst_margin_db`,`id`);