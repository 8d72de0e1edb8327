import { EntityRepository } from '@mikro-orm/mariadb';
import type { Team } from './entities/team.entity';

export class TeamRepository extends EntityRepository<Team> {}
