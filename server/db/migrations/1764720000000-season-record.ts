import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Cars and their co-drivers, dated setup snapshots (per corner and per axle), the
 * change log, events, runs, pressure readings, tyre sets with their mountings and
 * tread readings. Runs are tied to setups by the view `runs_with_setup`, computed
 * at read time so a backdated, edited or deleted snapshot never leaves a stale tie.
 */
export class SeasonRecord1764720000000 implements MigrationInterface {
  name = 'SeasonRecord1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE cars (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        owner_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        name text NOT NULL,
        class_code text NOT NULL,
        car_number text,
        tyre_size text,
        front_damper_positions integer CHECK (front_damper_positions BETWEEN 1 AND 100),
        front_damper_count_from text CHECK (front_damper_count_from IN ('full_stiff', 'full_soft')),
        rear_damper_positions integer CHECK (rear_damper_positions BETWEEN 1 AND 100),
        rear_damper_count_from text CHECK (rear_damper_count_from IN ('full_stiff', 'full_soft')),
        front_motion_ratio double precision,
        rear_motion_ratio double precision,
        notes text,
        version integer NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX cars_owner_idx ON cars (owner_id)`);
    await q.query(`
      CREATE TABLE car_co_drivers (
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (car_id, user_id)
      )`);
    await q.query(`CREATE INDEX car_co_drivers_user_idx ON car_co_drivers (user_id)`);

    await q.query(`
      CREATE TABLE setup_snapshots (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        label text NOT NULL,
        effective_from timestamptz NOT NULL,
        created_by uuid NOT NULL REFERENCES users(id),
        derived_from_id uuid REFERENCES setup_snapshots(id) ON DELETE SET NULL,
        notes text,
        front_anti_roll_bar text,
        rear_anti_roll_bar text,
        version integer NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX setup_snapshots_car_effective_idx ON setup_snapshots (car_id, effective_from DESC, created_at DESC)`);
    await q.query(`
      CREATE TABLE setup_corners (
        setup_id uuid NOT NULL REFERENCES setup_snapshots(id) ON DELETE CASCADE,
        corner text NOT NULL CHECK (corner IN ('lf', 'rf', 'lr', 'rr')),
        camber_deg double precision,
        toe_mm double precision,
        caster_deg double precision,
        spring_rate_n_per_mm double precision,
        ride_height_mm double precision,
        damper_clicks integer,
        damper_rebound_clicks integer,
        cold_pressure_kpa double precision,
        corner_weight_kg double precision,
        PRIMARY KEY (setup_id, corner)
      )`);

    await q.query(`
      CREATE TABLE change_log (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        changed_on date NOT NULL,
        what text NOT NULL,
        location text NOT NULL CHECK (location IN ('lf', 'rf', 'lr', 'rr', 'front', 'rear', 'car')),
        notes text,
        setup_id uuid REFERENCES setup_snapshots(id) ON DELETE SET NULL,
        created_by uuid NOT NULL REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX change_log_car_idx ON change_log (car_id, changed_on)`);

    await q.query(`
      CREATE TABLE events (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        created_by uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        name text NOT NULL,
        date date NOT NULL,
        venue text,
        kind text NOT NULL DEFAULT 'autocross' CHECK (kind IN ('autocross', 'track_day')),
        cone_penalty_sec double precision NOT NULL DEFAULT 2 CHECK (cone_penalty_sec >= 0),
        surface text,
        air_temp_c double precision,
        track_temp_c double precision,
        notes text,
        team_id uuid REFERENCES teams(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX events_created_by_idx ON events (created_by, date)`);

    await q.query(`
      CREATE TABLE runs (
        id uuid PRIMARY KEY,
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        event_id uuid NOT NULL REFERENCES events(id) ON DELETE CASCADE,
        driver_id uuid NOT NULL REFERENCES users(id),
        run_number integer NOT NULL CHECK (run_number >= 1),
        raw_time_sec double precision CHECK (raw_time_sec > 0 AND raw_time_sec < 1800),
        cones integer NOT NULL DEFAULT 0 CHECK (cones BETWEEN 0 AND 50),
        status text NOT NULL CHECK (status IN ('finished', 'dnf', 'off_course')),
        recorded_at timestamptz NOT NULL,
        notes text,
        version integer NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT runs_finished_has_time CHECK (status <> 'finished' OR raw_time_sec IS NOT NULL),
        CONSTRAINT runs_number_unique UNIQUE (event_id, car_id, driver_id, run_number)
      )`);
    await q.query(`CREATE INDEX runs_car_recorded_idx ON runs (car_id, recorded_at)`);

    await q.query(`
      CREATE TABLE pressure_readings (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        kind text NOT NULL CHECK (kind IN ('cold', 'hot')),
        taken_at timestamptz NOT NULL,
        run_id uuid REFERENCES runs(id) ON DELETE CASCADE,
        lf_kpa double precision,
        rf_kpa double precision,
        lr_kpa double precision,
        rr_kpa double precision,
        created_by uuid NOT NULL REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT pressure_readings_run_kind UNIQUE (run_id, kind)
      )`);
    await q.query(`CREATE INDEX pressure_readings_car_idx ON pressure_readings (car_id, taken_at)`);

    await q.query(`
      CREATE TABLE tyre_sets (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        label text NOT NULL,
        size text,
        bought_on date,
        start_tread_mm double precision,
        notes text,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX tyre_sets_car_idx ON tyre_sets (car_id)`);
    await q.query(`
      CREATE TABLE tyre_mountings (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        tyre_set_id uuid NOT NULL REFERENCES tyre_sets(id) ON DELETE CASCADE,
        mounted_at timestamptz NOT NULL,
        lf_tyre integer NOT NULL,
        rf_tyre integer NOT NULL,
        lr_tyre integer NOT NULL,
        rr_tyre integer NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX tyre_mountings_set_idx ON tyre_mountings (tyre_set_id, mounted_at)`);
    await q.query(`
      CREATE TABLE tread_readings (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        tyre_set_id uuid NOT NULL REFERENCES tyre_sets(id) ON DELETE CASCADE,
        taken_at timestamptz NOT NULL,
        event_id uuid REFERENCES events(id) ON DELETE SET NULL,
        notes text,
        created_by uuid NOT NULL REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX tread_readings_set_idx ON tread_readings (tyre_set_id, taken_at)`);
    await q.query(`
      CREATE TABLE tread_reading_corners (
        reading_id uuid NOT NULL REFERENCES tread_readings(id) ON DELETE CASCADE,
        corner text NOT NULL CHECK (corner IN ('lf', 'rf', 'lr', 'rr')),
        inner_mm double precision NOT NULL CHECK (inner_mm BETWEEN 0 AND 20),
        middle_mm double precision NOT NULL CHECK (middle_mm BETWEEN 0 AND 20),
        outer_mm double precision NOT NULL CHECK (outer_mm BETWEEN 0 AND 20),
        PRIMARY KEY (reading_id, corner)
      )`);

    // The run-to-setup tie: the car's snapshot with the latest effective_from not after
    // the run's recorded_at (ties broken by the later-created snapshot).
    await q.query(`
      CREATE VIEW runs_with_setup AS
      SELECT r.*, s.id AS setup_id
        FROM runs r
        LEFT JOIN LATERAL (
          SELECT ss.id FROM setup_snapshots ss
           WHERE ss.car_id = r.car_id AND ss.effective_from <= r.recorded_at
           ORDER BY ss.effective_from DESC, ss.created_at DESC, ss.id DESC
           LIMIT 1
        ) s ON true`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP VIEW IF EXISTS runs_with_setup`);
    for (const table of ['tread_reading_corners', 'tread_readings', 'tyre_mountings', 'tyre_sets', 'pressure_readings',
      'runs', 'events', 'change_log', 'setup_corners', 'setup_snapshots', 'car_co_drivers', 'cars']) {
      await q.query(`DROP TABLE IF EXISTS ${table}`);
    }
  }
}
