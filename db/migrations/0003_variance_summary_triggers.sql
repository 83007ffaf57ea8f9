-- A vehicle's variance summary (vehicle_variance_summaries) is deleted whenever a row the
-- judgement reads changes, so a stale figure cannot outlive the change that made it stale
-- (db/variance-summary.ts judges the vehicle again on the next read). What the judgement reads
-- (db/variance.ts, loadVariances): the vehicle's edition, that edition's lines and their
-- dependencies, the vehicle's fitments and concessions, accepted evidence on its fitments and
-- accepted evidence lodged on its jobs for a line key. Changes that only time brings (expiry,
-- removal or fitting dates passing) are the summary's valid_until, not a trigger's business.
-- The vehicle's fleet number, depot, platform and state are not in the summary: the fleet view
-- reads them live from vehicles, so changing them leaves the summary valid.
CREATE TRIGGER `vvs_fitments_insert` AFTER INSERT ON `fitments` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` = NEW.`vehicle_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_fitments_update` AFTER UPDATE ON `fitments` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` IN (OLD.`vehicle_id`, NEW.`vehicle_id`);
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_fitments_delete` AFTER DELETE ON `fitments` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` = OLD.`vehicle_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_concessions_insert` AFTER INSERT ON `concessions` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` = NEW.`vehicle_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_concessions_update` AFTER UPDATE ON `concessions` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` IN (OLD.`vehicle_id`, NEW.`vehicle_id`);
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_concessions_delete` AFTER DELETE ON `concessions` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` = OLD.`vehicle_id`;
END;
--> statement-breakpoint
-- Only accepted evidence changes a judgement: a row that is, or was, accepted clears the vehicle
-- of its fitment and the vehicle of its job.
CREATE TRIGGER `vvs_evidence_insert` AFTER INSERT ON `evidence` WHEN NEW.`status` = 'accepted' BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` IN (
    SELECT `vehicle_id` FROM `fitments` WHERE `id` = NEW.`fitment_id`
    UNION ALL SELECT `vehicle_id` FROM `jobs` WHERE `id` = NEW.`job_id`
  );
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_evidence_update` AFTER UPDATE ON `evidence` WHEN OLD.`status` = 'accepted' OR NEW.`status` = 'accepted' BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` IN (
    SELECT `vehicle_id` FROM `fitments` WHERE `id` IN (OLD.`fitment_id`, NEW.`fitment_id`)
    UNION ALL SELECT `vehicle_id` FROM `jobs` WHERE `id` IN (OLD.`job_id`, NEW.`job_id`)
  );
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_evidence_delete` AFTER DELETE ON `evidence` WHEN OLD.`status` = 'accepted' BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` IN (
    SELECT `vehicle_id` FROM `fitments` WHERE `id` = OLD.`fitment_id`
    UNION ALL SELECT `vehicle_id` FROM `jobs` WHERE `id` = OLD.`job_id`
  );
END;
--> statement-breakpoint
-- A job's evidence for a line key proves that line on the job's vehicle.
CREATE TRIGGER `vvs_jobs_vehicle` AFTER UPDATE OF `vehicle_id` ON `jobs` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` IN (OLD.`vehicle_id`, NEW.`vehicle_id`);
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_jobs_delete` AFTER DELETE ON `jobs` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` = OLD.`vehicle_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_vehicles_edition` AFTER UPDATE OF `edition_id`, `org_id` ON `vehicles` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `vehicle_id` IN (OLD.`id`, NEW.`id`);
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_edition_lines_insert` AFTER INSERT ON `edition_lines` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `edition_id` = NEW.`edition_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_edition_lines_update` AFTER UPDATE ON `edition_lines` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `edition_id` IN (OLD.`edition_id`, NEW.`edition_id`);
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_edition_lines_delete` AFTER DELETE ON `edition_lines` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `edition_id` = OLD.`edition_id`;
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_line_dependencies_insert` AFTER INSERT ON `line_dependencies` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `edition_id` IN (SELECT `edition_id` FROM `edition_lines` WHERE `id` IN (NEW.`line_id`, NEW.`depends_on_line_id`));
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_line_dependencies_update` AFTER UPDATE ON `line_dependencies` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `edition_id` IN (
    SELECT `edition_id` FROM `edition_lines` WHERE `id` IN (OLD.`line_id`, OLD.`depends_on_line_id`, NEW.`line_id`, NEW.`depends_on_line_id`)
  );
END;
--> statement-breakpoint
CREATE TRIGGER `vvs_line_dependencies_delete` AFTER DELETE ON `line_dependencies` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `edition_id` IN (SELECT `edition_id` FROM `edition_lines` WHERE `id` IN (OLD.`line_id`, OLD.`depends_on_line_id`));
END;
--> statement-breakpoint
-- The judgement does not read an edition's own row today; a change of its status or standard
-- clears its vehicles all the same, so a figure that comes to depend on them cannot go stale.
CREATE TRIGGER `vvs_editions_update` AFTER UPDATE OF `status`, `standard_id`, `org_id` ON `editions` BEGIN
  DELETE FROM `vehicle_variance_summaries` WHERE `edition_id` IN (OLD.`id`, NEW.`id`);
END;
