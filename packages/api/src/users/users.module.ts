import { MikroOrmModule } from '@mikro-orm/nestjs';
import { Module } from '@nestjs/common';
import { User } from './entities/user.entity';
import { PasswordService } from './password.service';

@Module({
  imports: [MikroOrmModule.forFeature([User])],
  providers: [PasswordService],
  exports: [MikroOrmModule, PasswordService],
})
export class UsersModule {}
