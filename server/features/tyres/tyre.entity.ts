import { Column, CreateDateColumn, Entity, PrimaryColumn, PrimaryGeneratedColumn } from 'typeorm';
import type { Corner } from '@shared/season/corners';

@Entity({ name: 'tyre_sets' })
export class TyreSetEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'car_id', type: 'uuid' }) carId!: string;
  @Column({ type: 'text' }) label!: string;
  @Column({ type: 'text', nullable: true }) size!: string | null;
  @Column({ name: 'bought_on', type: 'date', nullable: true }) boughtOn!: string | null;
  @Column({ name: 'start_tread_mm', type: 'double precision', nullable: true }) startTreadMm!: number | null;
  @Column({ type: 'text', nullable: true }) notes!: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
}

/** Which numbered tyre of the set is on which corner from `mountedAt` (a rotation adds a row). */
@Entity({ name: 'tyre_mountings' })
export class TyreMountingEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'tyre_set_id', type: 'uuid' }) tyreSetId!: string;
  @Column({ name: 'mounted_at', type: 'timestamptz' }) mountedAt!: Date;
  @Column({ name: 'lf_tyre', type: 'integer' }) lfTyre!: number;
  @Column({ name: 'rf_tyre', type: 'integer' }) rfTyre!: number;
  @Column({ name: 'lr_tyre', type: 'integer' }) lrTyre!: number;
  @Column({ name: 'rr_tyre', type: 'integer' }) rrTyre!: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
}

@Entity({ name: 'tread_readings' })
export class TreadReadingEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'tyre_set_id', type: 'uuid' }) tyreSetId!: string;
  @Column({ name: 'taken_at', type: 'timestamptz' }) takenAt!: Date;
  @Column({ name: 'event_id', type: 'uuid', nullable: true }) eventId!: string | null;
  @Column({ type: 'text', nullable: true }) notes!: string | null;
  @Column({ name: 'created_by', type: 'uuid' }) createdBy!: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
}

@Entity({ name: 'tread_reading_corners' })
export class TreadReadingCornerEntity {
  @PrimaryColumn({ name: 'reading_id', type: 'uuid' }) readingId!: string;
  @PrimaryColumn({ type: 'text' }) corner!: Corner;
  @Column({ name: 'inner_mm', type: 'double precision' }) innerMm!: number;
  @Column({ name: 'middle_mm', type: 'double precision' }) middleMm!: number;
  @Column({ name: 'outer_mm', type: 'double precision' }) outerMm!: number;
}
