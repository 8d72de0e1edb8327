import { randomUUID } from 'node:crypto';
import {
  Collection,
  Entity,
  EntityRepositoryType,
  OneToMany,
  Opt,
  PrimaryKey,
  Property,
} from '@mikro-orm/core';
import { TeamRepository } from '../team.repository';
import { Membership } from './membership.entity';

@Entity({ tableName: 'teams', repository: () => TeamRepository })
export class Team {
  [EntityRepositoryType]?: TeamRepository;

  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @Property({ type: 'string', length: 200 })
  name: string;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  @OneToMany({ entity: () => Membership, mappedBy: 'team' })
  memberships = new Collection<Membership>(this);

  constructor(name: string) {
    this.name = name;
  }
}
