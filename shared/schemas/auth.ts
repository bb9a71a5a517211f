import { z } from 'zod';
import { displayNameSchema, emailSchema, organisationNameSchema, prefixedIdSchema, timestampSchema } from './common';
import { permissionSchema, roleSchema } from './permissions';

export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 256;

export const signUpRequestSchema = z
  .strictObject({
    email: emailSchema,
    password: z
      .string()
      .min(PASSWORD_MIN_LENGTH)
      .max(PASSWORD_MAX_LENGTH)
      .meta({ description: `${PASSWORD_MIN_LENGTH} to ${PASSWORD_MAX_LENGTH} characters.`, example: 'correct-horse-battery' }),
    displayName: displayNameSchema,
    organisationName: organisationNameSchema,
  })
  .meta({
    id: 'SignUpRequest',
    description: 'Creates an account and a new organisation with the account as its owner.',
  });
export type SignUpRequest = z.infer<typeof signUpRequestSchema>;

export const signInRequestSchema = z
  .strictObject({
    email: emailSchema,
    password: z.string().min(1).max(PASSWORD_MAX_LENGTH).meta({ example: 'correct-horse-battery' }),
  })
  .meta({ id: 'SignInRequest' });
export type SignInRequest = z.infer<typeof signInRequestSchema>;

export const switchOrganisationRequestSchema = z
  .strictObject({
    organisationId: prefixedIdSchema('org', 'org_7kq2Vb9XwR4mT1sLp0aZ'),
  })
  .meta({ id: 'SwitchOrganisationRequest', description: 'Makes another of your organisations the active one.' });
export type SwitchOrganisationRequest = z.infer<typeof switchOrganisationRequestSchema>;

export const sessionSchema = z
  .object({
    user: z.object({
      id: prefixedIdSchema('usr', 'usr_Q2w8Lk3Zr5Tx9Pb1Nc0d'),
      email: emailSchema,
      displayName: displayNameSchema,
    }),
    activeOrganisation: z.object({
      id: prefixedIdSchema('org', 'org_7kq2Vb9XwR4mT1sLp0aZ'),
      name: organisationNameSchema,
      role: roleSchema,
    }),
    memberships: z.array(
      z.object({
        organisationId: prefixedIdSchema('org', 'org_7kq2Vb9XwR4mT1sLp0aZ'),
        organisationName: organisationNameSchema,
        role: roleSchema,
      }),
    ),
    permissions: z.array(permissionSchema).meta({ description: 'What the active role allows.' }),
    expiresAt: timestampSchema.meta({
      description: 'When the session cookie stops being accepted unless it is refreshed by further use.',
    }),
  })
  .meta({ id: 'Session', description: 'The signed-in user, the active organisation and what the user may do there.' });
export type Session = z.infer<typeof sessionSchema>;
