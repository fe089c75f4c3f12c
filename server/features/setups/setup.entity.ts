import { Column, CreateDateColumn, Entity, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { Corner } from '@shared/season/corners';

@Entity({ name: 'setup_snapshots' })
export class SetupSnapshotEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'car_id', type: 'uuid' }) carId!: string;
  @Column({ type: 'text' }) label!: string;
  @Column({ name: 'effective_from', type: 'timestamptz' }) effectiveFrom!: Date;
  @Column({ name: 'created_by', type: 'uuid' }) createdBy!: string;
  @Column({ name: 'derived_from_id', type: 'uuid', nullable: true }) derivedFromId!: string | null;
  @Column({ type: 'text', nullable: true }) notes!: string | null;
  @Column({ name: 'front_anti_roll_bar', type: 'text', nullable: true }) frontAntiRollBar!: string | null;
  @Column({ name: 'rear_anti_roll_bar', type: 'text', nullable: true }) rearAntiRollBar!: string | null;
  @Column({ type: 'integer', default: 1 }) version!: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt!: Date;
}

@Entity({ name: 'setup_corners' })
export class SetupCornerEntity {
  @PrimaryColumn({ name: 'setup_id', type: 'uuid' }) setupId!: string;
  @PrimaryColumn({ type: 'text' }) corner!: Corner;
  @Column({ name: 'camber_deg', type: 'double precision', nullable: true }) camberDeg!: number | null;
  @Column({ name: 'toe_mm', type: 'double precision', nullable: true }) toeMm!: number | null;
  @Column({ name: 'caster_deg', type: 'double precision', nullable: true }) casterDeg!: number | null;
  @Column({ name: 'spring_rate_n_per_mm', type: 'double precision', nullable: true }) springRateNPerMm!: number | null;
  @Column({ name: 'ride_height_mm', type: 'double precision', nullable: true }) rideHeightMm!: number | null;
  @Column({ name: 'damper_clicks', type: 'integer', nullable: true }) damperClicks!: number | null;
  @Column({ name: 'damper_rebound_clicks', type: 'integer', nullable: true }) damperReboundClicks!: number | null;
  @Column({ name: 'cold_pressure_kpa', type: 'double precision', nullable: true }) coldPressureKpa!: number | null;
  @Column({ name: 'corner_weight_kg', type: 'double precision', nullable: true }) cornerWeightKg!: number | null;
}
