export const authKeys = {
  root: ['auth'] as const,
  me: () => [...authKeys.root, 'me'] as const,
  invitation: (token: string) => [...authKeys.root, 'invitation', token] as const,
};
