import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import { User } from '../../users/entities/user.entity';

@Entity({ tableName: 'password_reset_tokens' })
export class PasswordResetToken {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  user: User;

  @Property({ type: 'string', length: 64, unique: true })
  tokenHash: string;

  @Property({ type: 'datetime' })
  expiresAt: Date;

  @Property({ type: 'datetime', nullable: true })
  usedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  constructor(user: User, tokenHash: string, expiresAt: Date) {
    this.user = user;
    this.tokenHash = tokenHash;
    this.expiresAt = expiresAt;
  }
}
