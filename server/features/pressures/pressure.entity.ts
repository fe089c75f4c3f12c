import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** Cold or hot pressures per corner, at a run or at a time. */
@Entity({ name: 'pressure_readings' })
export class PressureReadingEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'car_id', type: 'uuid' }) carId!: string;
  @Column({ type: 'text' }) kind!: 'cold' | 'hot';
  @Column({ name: 'taken_at', type: 'timestamptz' }) takenAt!: Date;
  @Column({ name: 'run_id', type: 'uuid', nullable: true }) runId!: string | null;
  @Column({ name: 'lf_kpa', type: 'double precision', nullable: true }) lfKpa!: number | null;
  @Column({ name: 'rf_kpa', type: 'double precision', nullable: true }) rfKpa!: number | null;
  @Column({ name: 'lr_kpa', type: 'double precision', nullable: true }) lrKpa!: number | null;
  @Column({ name: 'rr_kpa', type: 'double precision', nullable: true }) rrKpa!: number | null;
  @Column({ name: 'created_by', type: 'uuid' }) createdBy!: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
}
