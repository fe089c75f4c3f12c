import { Column, CreateDateColumn, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import type { RunStatus } from '@shared/season/run.schema';

/** The id is made by the client, so a replayed POST finds the row it already made. */
@Entity({ name: 'runs' })
export class RunEntity {
  @PrimaryColumn({ type: 'uuid' }) id!: string;
  @Column({ name: 'car_id', type: 'uuid' }) carId!: string;
  @Column({ name: 'event_id', type: 'uuid' }) eventId!: string;
  @Column({ name: 'driver_id', type: 'uuid' }) driverId!: string;
  @Column({ name: 'run_number', type: 'integer' }) runNumber!: number;
  @Column({ name: 'raw_time_sec', type: 'double precision', nullable: true }) rawTimeSec!: number | null;
  @Column({ type: 'integer', default: 0 }) cones!: number;
  @Column({ type: 'text' }) status!: RunStatus;
  @Column({ name: 'recorded_at', type: 'timestamptz' }) recordedAt!: Date;
  @Column({ type: 'text', nullable: true }) notes!: string | null;
  @Column({ type: 'integer', default: 1 }) version!: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt!: Date;
}
