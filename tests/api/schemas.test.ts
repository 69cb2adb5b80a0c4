import bcrypt from 'bcryptjs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ValidationError } from 'yup';
import {
  ACTIONS,
  INVITABLE_ROLES,
  POLICY,
  ROLES,
  can,
  invitationCreateSchema,
  loginSchema,
  memberUpdateSchema,
  newPasswordSchema,
  projectCreateSchema,
  projectListQuerySchema,
  projectUpdateSchema,
  seatLimit,
  signupSchema,
  utf8ByteLength,
} from '@basinwright/common';

async function errorsOf(
  schema: { validate(v: unknown, o: object): Promise<unknown> },
  value: unknown,
): Promise<Record<string, string>> {
  try {
    await schema.validate(value, { abortEarly: false, stripUnknown: true });
    return {};
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    const out: Record<string, string> = {};
    for (const item of error.inner.length > 0 ? error.inner : [error])
      out[item.path ?? ''] ??= item.message;
    return out;
  }
}

describe('utf8ByteLength', () => {
  it('agrees with Node’s own UTF-8 encoder on any string, lone surrogates included', () => {
    // Reference: Buffer.byteLength(s, 'utf8') (WHATWG encoding: a lone surrogate becomes U+FFFD, 3 bytes).
    fc.assert(
      fc.property(
        fc.string({ unit: 'binary', maxLength: 80 }),
        (s) => utf8ByteLength(s) === Buffer.byteLength(s, 'utf8'),
      ),
    );
    fc.assert(
      fc.property(
        fc.string({
          unit: fc.integer({ min: 0xd7f0, max: 0xe010 }).map((c) => String.fromCharCode(c)),
          maxLength: 20,
        }),
        (s) => utf8ByteLength(s) === Buffer.byteLength(s, 'utf8'),
      ),
    );
  });

  it('counts 1, 2, 3 and 4 bytes per code point (RFC 3629 §3)', () => {
    expect(utf8ByteLength('a')).toBe(1);
    expect(utf8ByteLength('é')).toBe(2);
    expect(utf8ByteLength('€')).toBe(3);
    expect(utf8ByteLength('𝄞')).toBe(4);
  });
});

describe('new password rule (bcrypt reads 72 bytes at most)', () => {
  it('bcrypt really ignores bytes after the 72nd — the reason longer passwords are refused', async () => {
    // Provos & Mazières, "A Future-Adaptable Password Scheme" (1999): key material is 72 bytes.
    const seventyTwo = 'é'.repeat(36); // 72 bytes
    const hash = await bcrypt.hash(seventyTwo, 4);
    expect(await bcrypt.compare(`${seventyTwo}anything`, hash)).toBe(true);
  });

  it('accepts 72 bytes of multibyte text and refuses 73+ bytes, never cutting it', async () => {
    await expect(newPasswordSchema.validate('é'.repeat(36))).resolves.toBe('é'.repeat(36)); // 72 bytes
    await expect(newPasswordSchema.validate('€'.repeat(24))).resolves.toBe('€'.repeat(24)); // 72 bytes
    await expect(newPasswordSchema.validate('𝄞'.repeat(18))).resolves.toBe('𝄞'.repeat(18)); // 72 bytes
    await expect(newPasswordSchema.validate(`${'é'.repeat(36)}x`)).rejects.toThrow(
      /at most 72 bytes/,
    ); // 73
    await expect(newPasswordSchema.validate('€'.repeat(25))).rejects.toThrow(/at most 72 bytes/); // 75 bytes, 25 chars
    await expect(newPasswordSchema.validate('a'.repeat(72))).resolves.toHaveLength(72);
    await expect(newPasswordSchema.validate('a'.repeat(73))).rejects.toThrow(/at most 72 bytes/);
  });

  it('needs 8 characters (counted as characters, not bytes) and keeps spaces', async () => {
    await expect(newPasswordSchema.validate('1234567')).rejects.toThrow(/at least 8 characters/);
    await expect(newPasswordSchema.validate('éééé')).rejects.toThrow(/at least 8 characters/); // 8 bytes, 4 chars
    await expect(newPasswordSchema.validate('𝄞𝄞𝄞𝄞𝄞𝄞𝄞𝄞')).resolves.toBe('𝄞𝄞𝄞𝄞𝄞𝄞𝄞𝄞');
    await expect(newPasswordSchema.validate('  spaced  ')).resolves.toBe('  spaced  ');
    await expect(newPasswordSchema.validate(undefined)).rejects.toThrow(/Enter a password/);
  });

  it('login refuses a password bcrypt would cut, with the sign-in message', async () => {
    expect(await errorsOf(loginSchema, { email: 'a@b.example', password: 'é'.repeat(37) })).toEqual(
      {
        password: 'Incorrect e-mail or password.',
      },
    );
  });
});

describe('signup schema', () => {
  it('normalises the e-mail and drops unknown keys', async () => {
    const value = await signupSchema.validate(
      {
        firmName: '  Acme  ',
        name: ' Ann ',
        email: '  Ann@Example.COM ',
        password: 'longenough',
        role: 'owner',
      },
      { stripUnknown: true },
    );
    expect(value).toEqual({
      firmName: 'Acme',
      name: 'Ann',
      email: 'ann@example.com',
      password: 'longenough',
    });
  });

  it('reports every bad field at once', async () => {
    expect(await errorsOf(signupSchema, { email: 'not-an-email', password: 'short' })).toEqual({
      firmName: 'Enter the name of your firm.',
      name: 'Enter your name.',
      email: 'Enter a valid e-mail address.',
      password: 'Use at least 8 characters.',
    });
  });
});

describe('project schemas', () => {
  it('create: fills defaults, turns null text into empty, rejects bad units/status', async () => {
    const value = await projectCreateSchema.validate(
      { name: ' Weir ', units: 'SI', client: null },
      { stripUnknown: true },
    );
    expect(value).toEqual({
      name: 'Weir',
      units: 'SI',
      client: '',
      location: '',
      status: 'draft',
      notes: '',
    });
    expect(
      await errorsOf(projectCreateSchema, { name: '', units: 'metric', status: 'done' }),
    ).toEqual({
      name: 'Enter a project name.',
      units: 'Choose SI or US customary units.',
      status: 'Choose one of: draft, in review, issued, archived.',
    });
    expect(await errorsOf(projectCreateSchema, { name: 'x'.repeat(201), units: 'US' })).toEqual({
      name: 'A project name has at most 200 characters.',
    });
  });

  it('update: partial, but not empty, and a name cannot be blanked', async () => {
    await expect(
      projectUpdateSchema.validate({ status: 'issued' }, { stripUnknown: true }),
    ).resolves.toMatchObject({ status: 'issued' });
    expect(await errorsOf(projectUpdateSchema, {})).toEqual({ '': 'Change at least one field.' });
    expect(await errorsOf(projectUpdateSchema, { name: '   ' })).toEqual({
      name: 'Enter a project name.',
    });
  });

  it('list query: casts query-string text, defaults, bounds', async () => {
    expect(
      await projectListQuerySchema.validate({
        page: '2',
        pageSize: '5',
        sort: 'name',
        order: 'asc',
      }),
    ).toEqual({
      search: '',
      page: 2,
      pageSize: 5,
      sort: 'name',
      order: 'asc',
    });
    expect(await projectListQuerySchema.validate({ sort: '', page: '' })).toMatchObject({
      sort: 'updatedAt',
      page: 1,
      pageSize: 20,
      order: 'desc',
    });
    expect(
      await errorsOf(projectListQuerySchema, {
        page: '0',
        pageSize: '101',
        sort: 'id',
        order: 'up',
      }),
    ).toEqual({
      page: 'Page starts at 1.',
      pageSize: 'Page size is at most 100.',
      sort: 'Sort by one of: updatedAt, createdAt, name, client, status.',
      order: 'Order is asc or desc.',
    });
    expect(await errorsOf(projectListQuerySchema, { page: 'two' })).toEqual({
      page: 'Page must be a whole number.',
    });
  });
});

describe('member schemas', () => {
  it('invitation: any role but owner', async () => {
    for (const role of INVITABLE_ROLES) {
      await expect(
        invitationCreateSchema.validate({ email: 'x@y.example', role }),
      ).resolves.toMatchObject({ role });
    }
    expect(await errorsOf(invitationCreateSchema, { email: 'x@y.example', role: 'owner' })).toEqual(
      {
        role: 'Choose one of: admin, engineer, estimator, viewer.',
      },
    );
  });

  it('member update: role or active, not nothing', async () => {
    await expect(memberUpdateSchema.validate({ active: false })).resolves.toEqual({
      active: false,
    });
    expect(await errorsOf(memberUpdateSchema, {})).toEqual({
      '': 'Change the role or the active flag.',
    });
    expect(await errorsOf(memberUpdateSchema, { role: 'boss' })).toHaveProperty('role');
  });
});

describe('policy table and plan limits', () => {
  it('names only known roles; the owner may do everything, an admin all but change the billing', () => {
    for (const action of ACTIONS) {
      for (const role of POLICY[action]) expect(ROLES).toContain(role);
      expect(can('owner', action)).toBe(true);
      // issue 10: the Billing page is the owner's; admins see plan and seats read-only
      const ownersOnly = action.startsWith('billing.') && action !== 'billing.read';
      expect(can('admin', action)).toBe(!ownersOnly);
    }
  });

  it('follows the roles of the product brief', () => {
    // product.md: viewers read; engineers create and edit projects; estimators read designs; admins manage members.
    expect(can('viewer', 'projects.read')).toBe(true);
    expect(can('viewer', 'projects.create')).toBe(false);
    expect(can('estimator', 'projects.update')).toBe(false);
    expect(can('engineer', 'projects.delete')).toBe(true);
    expect(can('engineer', 'members.list')).toBe(false);
  });

  it('caps Concept at one seat whatever was bought', () => {
    expect(seatLimit('concept', 5)).toBe(1);
    expect(seatLimit('firm', 5)).toBe(5);
  });
});
