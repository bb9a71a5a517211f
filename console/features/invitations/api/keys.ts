export const invitationKeys = {
  all: ['invitations'] as const,
  lists: () => [...invitationKeys.all, 'list'] as const,
  list: () => [...invitationKeys.lists()] as const,
  lookup: (token: string) => [...invitationKeys.all, 'lookup', token] as const,
};
