import { Column, CreateDateColumn, Entity, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

@Entity({ name: 'cars' })
export class CarEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'owner_id', type: 'uuid' }) ownerId!: string;
  @Column({ type: 'text' }) name!: string;
  @Column({ name: 'class_code', type: 'text' }) classCode!: string;
  @Column({ name: 'car_number', type: 'text', nullable: true }) carNumber!: string | null;
  @Column({ name: 'tyre_size', type: 'text', nullable: true }) tyreSize!: string | null;
  @Column({ name: 'front_damper_positions', type: 'integer', nullable: true }) frontDamperPositions!: number | null;
  @Column({ name: 'front_damper_count_from', type: 'text', nullable: true }) frontDamperCountFrom!: 'full_stiff' | 'full_soft' | null;
  @Column({ name: 'rear_damper_positions', type: 'integer', nullable: true }) rearDamperPositions!: number | null;
  @Column({ name: 'rear_damper_count_from', type: 'text', nullable: true }) rearDamperCountFrom!: 'full_stiff' | 'full_soft' | null;
  /** Double-adjustable dampers' rebound adjuster; null when the axle's dampers have one adjuster or none. */
  @Column({ name: 'front_damper_rebound_positions', type: 'integer', nullable: true }) frontDamperReboundPositions!: number | null;
  @Column({ name: 'front_damper_rebound_count_from', type: 'text', nullable: true }) frontDamperReboundCountFrom!: 'full_stiff' | 'full_soft' | null;
  @Column({ name: 'rear_damper_rebound_positions', type: 'integer', nullable: true }) rearDamperReboundPositions!: number | null;
  @Column({ name: 'rear_damper_rebound_count_from', type: 'text', nullable: true }) rearDamperReboundCountFrom!: 'full_stiff' | 'full_soft' | null;
  @Column({ name: 'front_motion_ratio', type: 'double precision', nullable: true }) frontMotionRatio!: number | null;
  @Column({ name: 'rear_motion_ratio', type: 'double precision', nullable: true }) rearMotionRatio!: number | null;
  @Column({ type: 'text', nullable: true }) notes!: string | null;
  @Column({ type: 'integer', default: 1 }) version!: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt!: Date;
}

@Entity({ name: 'car_co_drivers' })
export class CarCoDriverEntity {
  @PrimaryColumn({ name: 'car_id', type: 'uuid' }) carId!: string;
  @PrimaryColumn({ name: 'user_id', type: 'uuid' }) userId!: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
}
