-- An activation records what it was shown: the comparison of the version with the one in force
-- on the same held-out tickets (compact JSON, as evaluate wrote it; null when there was none, as
-- for a rollback), and whether the manager acknowledged activating it although it was worse, not
-- compared, or compared on other knowledge. Plain SQL that H2 and PostgreSQL both run;
-- IF NOT EXISTS because V1's baseline rule (ServiceSchema) may run this over a database that
-- already has the columns.
ALTER TABLE model_activation ADD COLUMN IF NOT EXISTS comparison VARCHAR(4000);
ALTER TABLE model_activation ADD COLUMN IF NOT EXISTS acknowledged BOOLEAN DEFAULT FALSE NOT NULL;
