import { Column, CreateDateColumn, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import type { SuggestionChange, SuggestionStatus } from '@shared/collab/suggestion.schema';

/** A shop's proposed change to one of a car's setup snapshots. The id is made on the device, or by the server when the device sends none. */
@Entity({ name: 'setup_suggestions' })
export class SetupSuggestionEntity {
  @PrimaryColumn({ type: 'uuid' }) id!: string;
  @Column({ name: 'car_id', type: 'uuid' }) carId!: string;
  @Column({ name: 'base_setup_id', type: 'uuid' }) baseSetupId!: string;
  @Column({ name: 'shop_id', type: 'uuid' }) shopId!: string;
  @Column({ name: 'author_id', type: 'uuid' }) authorId!: string;
  @Column({ type: 'text' }) title!: string;
  @Column({ type: 'text' }) rationale!: string;
  @Column({ type: 'jsonb' }) changes!: SuggestionChange[];
  @Column({ type: 'text', default: 'open' }) status!: SuggestionStatus;
  @Column({ name: 'decided_by', type: 'uuid', nullable: true }) decidedBy!: string | null;
  @Column({ name: 'decided_at', type: 'timestamptz', nullable: true }) decidedAt!: Date | null;
  @Column({ name: 'decision_note', type: 'text', nullable: true }) decisionNote!: string | null;
  @Column({ name: 'accepted_setup_id', type: 'uuid', nullable: true }) acceptedSetupId!: string | null;
  @Column({ type: 'integer', default: 1 }) version!: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt!: Date;
}
