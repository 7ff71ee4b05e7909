namespace PlanDesk.Server.Store;

/// <summary>
/// The schema, as numbered steps applied once each and recorded in <c>schema_migrations</c>.
/// Never edit a released step: add the next one. <c>{id}</c> is the database's auto-numbered key column.
/// Instants are stored as Unix milliseconds, local dates as ISO text, documents as JSON text.
/// </summary>
internal static class Migrations
{
    public sealed record Step(int Version, string Name, string Sql);

    public const string CreateMigrationsTable =
        "CREATE TABLE IF NOT EXISTS schema_migrations (version BIGINT PRIMARY KEY, name TEXT NOT NULL, applied_at BIGINT NOT NULL)";

    public static IReadOnlyList<Step> All { get; } =
    [
        new(1, "keys, networks, plans, publications, targets, acknowledgements, actuals", """
            CREATE TABLE api_keys (
                key_id TEXT PRIMARY KEY,
                key_hash TEXT NOT NULL,
                role TEXT NOT NULL,
                plant_id TEXT NULL,
                label TEXT NOT NULL,
                created_at BIGINT NOT NULL,
                revoked_at BIGINT NULL);

            CREATE TABLE network_versions (
                network_id TEXT NOT NULL,
                version BIGINT NOT NULL,
                name TEXT NOT NULL,
                document TEXT NOT NULL,
                uploaded_at BIGINT NOT NULL,
                uploaded_by TEXT NOT NULL,
                PRIMARY KEY (network_id, version));

            CREATE TABLE network_plants (
                network_id TEXT NOT NULL,
                version BIGINT NOT NULL,
                plant_id TEXT NOT NULL,
                plant_name TEXT NOT NULL,
                PRIMARY KEY (network_id, version, plant_id),
                FOREIGN KEY (network_id, version) REFERENCES network_versions (network_id, version));
            CREATE INDEX ix_network_plants_plant ON network_plants (plant_id);

            CREATE TABLE plans (
                id {id},
                network_id TEXT NOT NULL,
                network_version BIGINT NOT NULL,
                start_date TEXT NOT NULL,
                days BIGINT NOT NULL,
                options TEXT NOT NULL,
                state TEXT NOT NULL,
                cancel_requested BIGINT NOT NULL DEFAULT 0,
                progress TEXT NULL,
                message TEXT NULL,
                submitted_at BIGINT NOT NULL,
                submitted_by TEXT NOT NULL,
                started_at BIGINT NULL,
                finished_at BIGINT NULL,
                summary_document TEXT NULL,
                plan_document TEXT NULL,
                check_document TEXT NULL,
                target_sheets TEXT NULL,
                FOREIGN KEY (network_id, network_version) REFERENCES network_versions (network_id, version));
            CREATE INDEX ix_plans_state ON plans (state, id);

            CREATE TABLE publications (
                id {id},
                plan_id BIGINT NOT NULL REFERENCES plans (id),
                published_at BIGINT NOT NULL,
                published_by TEXT NOT NULL,
                note TEXT NULL);

            CREATE TABLE targets (
                plant_id TEXT NOT NULL,
                local_date TEXT NOT NULL,
                version BIGINT NOT NULL,
                publication_id BIGINT NOT NULL REFERENCES publications (id),
                plan_id BIGINT NOT NULL,
                published_at BIGINT NOT NULL,
                sheet TEXT NOT NULL,
                PRIMARY KEY (plant_id, local_date, version));
            CREATE INDEX ix_targets_publication ON targets (publication_id);

            CREATE TABLE acknowledgements (
                id {id},
                plant_id TEXT NOT NULL,
                local_date TEXT NOT NULL,
                target_version BIGINT NOT NULL,
                idempotency_key TEXT NOT NULL,
                request_hash TEXT NOT NULL,
                received_at BIGINT NOT NULL,
                key_id TEXT NOT NULL,
                acknowledged_by TEXT NULL,
                note TEXT NULL,
                UNIQUE (plant_id, idempotency_key),
                FOREIGN KEY (plant_id, local_date, target_version) REFERENCES targets (plant_id, local_date, version));
            CREATE INDEX ix_acknowledgements_day ON acknowledgements (plant_id, local_date);

            CREATE TABLE actuals_reports (
                id {id},
                plant_id TEXT NOT NULL,
                idempotency_key TEXT NOT NULL,
                request_hash TEXT NOT NULL,
                received_at BIGINT NOT NULL,
                key_id TEXT NOT NULL,
                row_count BIGINT NOT NULL,
                first_hour_start BIGINT NOT NULL,
                last_hour_start BIGINT NOT NULL,
                UNIQUE (plant_id, idempotency_key));

            CREATE TABLE actuals_hours (
                report_id BIGINT NOT NULL REFERENCES actuals_reports (id),
                plant_id TEXT NOT NULL,
                hour_start BIGINT NOT NULL,
                row_data TEXT NOT NULL,
                PRIMARY KEY (report_id, hour_start));
            CREATE INDEX ix_actuals_hours_plant ON actuals_hours (plant_id, hour_start);
            """),
    ];
}
