import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

@Entity({ name: 'events' })
export class EventEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'created_by', type: 'uuid' }) createdBy!: string;
  @Column({ type: 'text' }) name!: string;
  @Column({ type: 'date' }) date!: string;
  @Column({ type: 'text', nullable: true }) venue!: string | null;
  @Column({ type: 'text', default: 'autocross' }) kind!: 'autocross' | 'track_day';
  @Column({ name: 'cone_penalty_sec', type: 'double precision', default: 2 }) conePenaltySec!: number;
  @Column({ type: 'text', nullable: true }) surface!: string | null;
  @Column({ name: 'air_temp_c', type: 'double precision', nullable: true }) airTempC!: number | null;
  @Column({ name: 'track_temp_c', type: 'double precision', nullable: true }) trackTempC!: number | null;
  @Column({ type: 'text', nullable: true }) notes!: string | null;
  @Column({ name: 'team_id', type: 'uuid', nullable: true }) teamId!: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt!: Date;
}
