import { randomUUID } from 'node:crypto';
import { Entity, Index, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import { User } from '../../users/entities/user.entity';

/**
 * Only the SHA-256 of the cookie value is stored, so a leaked table cannot sign anyone in. Each sign-in
 * starts a family; every rotation of it stays in that family, which ends whole when one of its tokens is
 * shown after it was rotated.
 */
@Entity({ tableName: 'refresh_tokens' })
export class RefreshToken {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  user: User;

  @Property({ type: 'string', length: 64, unique: true })
  tokenHash: string;

  @Index()
  @Property({ type: 'string', length: 36 })
  familyId: string;

  @Property({ type: 'datetime' })
  expiresAt: Date;

  @Index()
  @Property({ type: 'datetime', nullable: true })
  revokedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  constructor(user: User, tokenHash: string, expiresAt: Date, familyId: string) {
    this.user = user;
    this.tokenHash = tokenHash;
    this.expiresAt = expiresAt;
    this.familyId = familyId;
  }
}
