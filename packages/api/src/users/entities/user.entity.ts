import { randomUUID } from 'node:crypto';
import { Entity, EntityRepositoryType, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import type { NoticeKind } from '@limbus/schema';
import { UserRepository } from '../user.repository';

@Entity({ tableName: 'users', repository: () => UserRepository })
export class User {
  [EntityRepositoryType]?: UserRepository;

  // Random ids so that one team cannot guess another team's objects by counting.
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  /** Stored lower-case; e-mail addresses are compared case-insensitively. */
  @Property({ type: 'string', length: 254, unique: true })
  email: string;

  @Property({ type: 'string', length: 200 })
  name: string;

  /** argon2id PHC string (algorithm, parameters and salt travel with the hash). */
  @Property({ type: 'string', length: 255, hidden: true })
  passwordHash: string;

  @Property({ type: 'boolean' })
  isAdmin: boolean & Opt = false;

  /** E-mail notice kinds this user turned off; everything else is sent. */
  @Property({ type: 'json' })
  noticeOptOuts: NoticeKind[] & Opt = [];

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  constructor(email: string, name: string, passwordHash: string) {
    this.email = email.toLowerCase();
    this.name = name;
    this.passwordHash = passwordHash;
  }
}
