import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity({ name: 'change_log' })
export class ChangeLogEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'car_id', type: 'uuid' }) carId!: string;
  @Column({ name: 'changed_on', type: 'date' }) changedOn!: string;
  @Column({ type: 'text' }) what!: string;
  @Column({ type: 'text' }) location!: 'lf' | 'rf' | 'lr' | 'rr' | 'front' | 'rear' | 'car';
  @Column({ type: 'text', nullable: true }) notes!: string | null;
  @Column({ name: 'setup_id', type: 'uuid', nullable: true }) setupId!: string | null;
  /** The shop visit whose handover wrote this entry, if one did. */
  @Column({ name: 'work_order_id', type: 'uuid', nullable: true }) workOrderId!: string | null;
  @Column({ name: 'created_by', type: 'uuid' }) createdBy!: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
}
