import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/** One comment in a thread; exactly one of the targets is set. The id is made on the device, or by the server when the device sends none. */
@Entity({ name: 'comments' })
export class CommentEntity {
  @PrimaryColumn({ type: 'uuid' }) id!: string;
  @Column({ name: 'car_id', type: 'uuid' }) carId!: string;
  @Column({ name: 'run_id', type: 'uuid', nullable: true }) runId!: string | null;
  @Column({ name: 'event_id', type: 'uuid', nullable: true }) eventId!: string | null;
  @Column({ name: 'setup_id', type: 'uuid', nullable: true }) setupId!: string | null;
  @Column({ name: 'tread_reading_id', type: 'uuid', nullable: true }) treadReadingId!: string | null;
  @Column({ name: 'work_order_id', type: 'uuid', nullable: true }) workOrderId!: string | null;
  @Column({ name: 'author_id', type: 'uuid' }) authorId!: string;
  /** The shop the author wrote for, when they are its staff rather than a driver of the car. */
  @Column({ name: 'shop_id', type: 'uuid', nullable: true }) shopId!: string | null;
  @Column({ type: 'text' }) body!: string;
  @Column({ type: 'integer', default: 1 }) version!: number;
  @Column({ name: 'edited_at', type: 'timestamptz', nullable: true }) editedAt!: Date | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
}
