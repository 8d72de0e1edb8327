import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC = 'limbus:isPublic';

/** Opts a route out of the global JwtAuthGuard; everything else requires a valid access token. */
export const Public = (): MethodDecorator & ClassDecorator => SetMetadata(IS_PUBLIC, true);
