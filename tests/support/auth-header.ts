import type { BuiltMember } from './workshop-builder';

/** The Authorization header of a built member. */
export const bearer = (member: Pick<BuiltMember, 'token'>) => ({
  Authorization: `Bearer ${member.token}`,
});
