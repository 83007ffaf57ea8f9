-- Register pages filtered by trip readiness are kept too (db/register-cache.ts); readiness
-- also turns with open defects, so a change to any defect raises the register's revision.
CREATE TRIGGER `rr_defects_insert` AFTER INSERT ON `defects` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_defects_update` AFTER UPDATE ON `defects` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
--> statement-breakpoint
CREATE TRIGGER `rr_defects_delete` AFTER DELETE ON `defects` BEGIN
  UPDATE `register_revision` SET `revision` = `revision` + 1 WHERE `id` = 1;
END;
