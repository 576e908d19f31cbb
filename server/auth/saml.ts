/** The SAML service-provider strategy (passport + @node-saml/passport-saml). */
import { Strategy as SamlStrategy, type Profile } from '@node-saml/passport-saml';
import passport from 'passport';
import type { Config } from '../config';

/** Settings the SP needs, resolved from the configuration and the (fake or real) IdP. */
export interface SamlSettings {
  callbackUrl: string;
  entryPoint: string;
  issuer: string;
  idpCert: string;
  /** Expected Issuer of responses, when known. */
  idpIssuer?: string;
}

/** Resolves the SP settings: a configured IdP, or the built-in fake one. */
export function samlSettings(config: Config, fakeIdpCert: string | null): SamlSettings {
  const callbackUrl = `${config.publicUrl}/api/auth/saml/callback`;
  if (config.samlEntryPoint) {
    if (!config.samlIdpCert) throw new Error('SAML_IDP_CERT must be set together with SAML_ENTRY_POINT');
    return { callbackUrl, entryPoint: config.samlEntryPoint, issuer: config.samlIssuer, idpCert: config.samlIdpCert };
  }
  if (!fakeIdpCert) throw new Error('No identity provider certificate');
  return { callbackUrl, entryPoint: `${config.publicUrl}/fake-idp/sso`, issuer: config.samlIssuer, idpCert: fakeIdpCert, idpIssuer: `${config.publicUrl}/fake-idp` };
}

/** A passport instance of our own (not the global one) with the "saml" strategy registered. */
export function createSamlPassport(s: SamlSettings): { passport: passport.PassportStatic; strategy: SamlStrategy } {
  const strategy = new SamlStrategy(
    {
      callbackUrl: s.callbackUrl,
      entryPoint: s.entryPoint,
      issuer: s.issuer,
      idpCert: s.idpCert,
      idpIssuer: s.idpIssuer,
      wantAssertionsSigned: true,
      wantAuthnResponseSigned: true,
      acceptedClockSkewMs: 5_000,
      validateInResponseTo: 'always' as never,
      requestIdExpirationPeriodMs: 10 * 60_000,
      identifierFormat: 'urn:oasis:names:tc:SAML:1.1:nameid-format:emailAddress',
      disableRequestedAuthnContext: true,
    },
    (profile: Profile | null, done: (err: Error | null, user?: Record<string, unknown>) => void) => done(null, profile ?? undefined),
    (profile: Profile | null, done: (err: Error | null, user?: Record<string, unknown>) => void) => done(null, profile ?? undefined),
  );
  const instance = new passport.Passport() as unknown as passport.PassportStatic;
  instance.use('saml', strategy as unknown as passport.Strategy);
  return { passport: instance, strategy };
}

/**
 * Normalises a SAML profile's attributes: single-valued ones arrive as a string,
 * multi-valued ones as an array; both become string[]. URN-style names
 * (urn:oid:…) are kept as sent.
 */
export function normaliseAttributes(profile: Record<string, unknown>): Record<string, string[]> {
  const src = (profile['attributes'] as Record<string, unknown> | undefined) ?? profile;
  const out: Record<string, string[]> = {};
  for (const [k, v] of Object.entries(src)) {
    if (['issuer', 'nameID', 'nameIDFormat', 'nameQualifier', 'spNameQualifier', 'sessionIndex', 'inResponseTo', 'attributes', 'getAssertion', 'getAssertionXml', 'getSamlResponseXml'].includes(k)) continue;
    const values = (Array.isArray(v) ? v : [v]).filter((x): x is string | number => typeof x === 'string' || typeof x === 'number').map(String).map((x) => x.trim()).filter(Boolean);
    if (values.length) out[k] = values;
  }
  return out;
}
