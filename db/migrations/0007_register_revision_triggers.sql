-- The register's revision (register_revision) rises with every change to a row the vehicle
-- register shows or filters by, so a page computed at one revision is known to be current while
-- the revision is unchanged (db/register-cache.ts). What a register page reads (db/vehicles.ts,
-- listVehiclesPage): vehicles with their platform, depot, edition and standard; assigned drivers
-- and their names; the contractor scope (jobs and job offers); and the variance status, which is
-- judged from the tables db/variance.ts reads (fitments, concessions, evidence, edition lines and
-- their dependencies, jobs). Changes that only time brings are the cached page's valid_until.
INSERT INTO `register_revision` (`id`, `revision`) VALUES (1, 0);
--> statement-breakpoint
CREATE TRIGGER `rr_vehicles_insert` AFTER INSERT ON `vehicles` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_vehicles_update` AFTER UPDATE ON `vehicles` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_vehicles_delete` AFTER DELETE ON `vehicles` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_platforms_insert` AFTER INSERT ON `platforms` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_platforms_update` AFTER UPDATE ON `platforms` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_platforms_delete` AFTER DELETE ON `platforms` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_depots_insert` AFTER INSERT ON `depots` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_depots_update` AFTER UPDATE ON `depots` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_depots_delete` AFTER DELETE ON `depots` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_editions_insert` AFTER INSERT ON `editions` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_editions_update` AFTER UPDATE ON `editions` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_editions_delete` AFTER DELETE ON `editions` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_standards_insert` AFTER INSERT ON `standards` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_standards_update` AFTER UPDATE ON `standards` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_standards_delete` AFTER DELETE ON `standards` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_vehicle_drivers_insert` AFTER INSERT ON `vehicle_drivers` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_vehicle_drivers_update` AFTER UPDATE ON `vehicle_drivers` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_vehicle_drivers_delete` AFTER DELETE ON `vehicle_drivers` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_jobs_insert` AFTER INSERT ON `jobs` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_jobs_update` AFTER UPDATE ON `jobs` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_jobs_delete` AFTER DELETE ON `jobs` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_job_offers_insert` AFTER INSERT ON `job_offers` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_job_offers_update` AFTER UPDATE ON `job_offers` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_job_offers_delete` AFTER DELETE ON `job_offers` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_fitments_insert` AFTER INSERT ON `fitments` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_fitments_update` AFTER UPDATE ON `fitments` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_fitments_delete` AFTER DELETE ON `fitments` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_concessions_insert` AFTER INSERT ON `concessions` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_concessions_update` AFTER UPDATE ON `concessions` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_concessions_delete` AFTER DELETE ON `concessions` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_evidence_insert` AFTER INSERT ON `evidence` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_evidence_update` AFTER UPDATE ON `evidence` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_evidence_delete` AFTER DELETE ON `evidence` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_edition_lines_insert` AFTER INSERT ON `edition_lines` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_edition_lines_update` AFTER UPDATE ON `edition_lines` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_edition_lines_delete` AFTER DELETE ON `edition_lines` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_line_dependencies_insert` AFTER INSERT ON `line_dependencies` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_line_dependencies_update` AFTER UPDATE ON `line_dependencies` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_line_dependencies_delete` AFTER DELETE ON `line_dependencies` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
-- A user's name shows beside the vehicles they drive; other user columns do not show.
CREATE TRIGGER `rr_users_name` AFTER UPDATE OF `name` ON `users` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
