// The invitation payloads are defined once in @limbus/schema, which the client's forms use too.
export {
  type AcceptInvitationPayload as AcceptInvitationDto,
  acceptInvitationPayloadSchema as AcceptInvitationSchema,
  type CreateInvitationPayload as CreateInvitationDto,
  createInvitationPayloadSchema as CreateInvitationSchema,
} from '@limbus/schema';
