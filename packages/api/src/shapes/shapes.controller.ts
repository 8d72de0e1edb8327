import { Body, Controller, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { TeamMember } from '../teams/roles.decorator';
import { type ShapePayload, shapePayloadSchema } from './shape-schemas';
import { ShapesService, type ShapeView } from './shapes.service';

@ApiTags('shapes')
@ApiBearerAuth()
@Controller()
export class ShapesController {
  constructor(private readonly shapes: ShapesService) {}

  // Synchronous: the fit takes milliseconds and stores nothing, so any member of the team may run it.
  @Post('teams/:teamId/shape')
  @TeamMember()
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(shapePayloadSchema) })
  fit(
    @Param('teamId') teamId: string,
    @Body(new ZodValidationPipe(shapePayloadSchema)) body: ShapePayload,
  ): Promise<ShapeView> {
    return this.shapes.fit(teamId, body);
  }
}
