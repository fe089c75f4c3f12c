import { Column, CreateDateColumn, Entity, PrimaryColumn, PrimaryGeneratedColumn } from 'typeorm';

/** A shop that sets up customers' cars. All its staff act under one shared role. */
@Entity({ name: 'shops' })
export class ShopEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'text' })
  name!: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}

@Entity({ name: 'shop_members' })
export class ShopMemberEntity {
  @PrimaryColumn({ name: 'shop_id', type: 'uuid' })
  shopId!: string;

  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId!: string;

  /** May invite and remove staff. */
  @Column({ name: 'is_shop_admin', type: 'boolean', default: false })
  isShopAdmin!: boolean;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
