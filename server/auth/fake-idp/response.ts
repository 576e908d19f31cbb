/**
 * Builds and signs the fake IdP's SAML Response: assertion signed first, then the
 * whole response (RSA-SHA256, exclusive c14n, signature right after each Issuer),
 * which is what the SP strategy expects by default.
 */
import { randomUUID } from 'node:crypto';
import { SignedXml } from 'xml-crypto';
import type { IdpKeys } from './keys';

/** Everything the response asserts. */
export interface AssertionInput {
  idpEntityId: string;
  spEntityId: string;
  acsUrl: string;
  inResponseTo: string;
  nameId: string;
  attributes: Record<string, string | string[]>;
  now?: Date;
}

const esc = (s: string) => s.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' })[c]!);

function sign(xml: string, keys: IdpKeys, element: 'Assertion' | 'Response'): string {
  const sig = new SignedXml({
    privateKey: keys.privateKeyPem,
    publicCert: keys.certPem,
    canonicalizationAlgorithm: 'http://www.w3.org/2001/10/xml-exc-c14n#',
    signatureAlgorithm: 'http://www.w3.org/2001/04/xmldsig-more#rsa-sha256',
  });
  const self = `//*[local-name(.)='${element}']`;
  sig.addReference({
    xpath: self,
    transforms: ['http://www.w3.org/2000/09/xmldsig#enveloped-signature', 'http://www.w3.org/2001/10/xml-exc-c14n#'],
    digestAlgorithm: 'http://www.w3.org/2001/04/xmlenc#sha256',
  });
  sig.computeSignature(xml, { prefix: 'ds', location: { reference: `${self}/*[local-name(.)='Issuer']`, action: 'after' } });
  return sig.getSignedXml();
}

/** Returns the signed Response XML. NotBefore is backdated 30 s to tolerate clock skew. */
export function buildSignedResponse(input: AssertionInput, keys: IdpKeys): string {
  const now = input.now ?? new Date();
  const t = (offsetMs: number) => new Date(now.getTime() + offsetMs).toISOString();
  const attrs = Object.entries(input.attributes)
    .map(([name, v]) => `<saml:Attribute Name="${esc(name)}" NameFormat="urn:oasis:names:tc:SAML:2.0:attrname-format:basic">${
      (Array.isArray(v) ? v : [v]).map((x) => `<saml:AttributeValue>${esc(x)}</saml:AttributeValue>`).join('')}</saml:Attribute>`)
    .join('');
  const ns = 'xmlns:samlp="urn:oasis:names:tc:SAML:2.0:protocol" xmlns:saml="urn:oasis:names:tc:SAML:2.0:assertion"';
  const assertion =
    `<saml:Assertion xmlns:saml="urn:oasis:names:tc:SAML:2.0:assertion" ID="_a${randomUUID()}" Version="2.0" IssueInstant="${t(0)}">` +
    `<saml:Issuer>${esc(input.idpEntityId)}</saml:Issuer>` +
    `<saml:Subject><saml:NameID Format="urn:oasis:names:tc:SAML:1.1:nameid-format:emailAddress">${esc(input.nameId)}</saml:NameID>` +
    `<saml:SubjectConfirmation Method="urn:oasis:names:tc:SAML:2.0:cm:bearer"><saml:SubjectConfirmationData InResponseTo="${esc(input.inResponseTo)}" NotOnOrAfter="${t(300_000)}" Recipient="${esc(input.acsUrl)}"/></saml:SubjectConfirmation></saml:Subject>` +
    `<saml:Conditions NotBefore="${t(-30_000)}" NotOnOrAfter="${t(300_000)}"><saml:AudienceRestriction><saml:Audience>${esc(input.spEntityId)}</saml:Audience></saml:AudienceRestriction></saml:Conditions>` +
    `<saml:AuthnStatement AuthnInstant="${t(0)}" SessionIndex="_s${randomUUID()}"><saml:AuthnContext><saml:AuthnContextClassRef>urn:oasis:names:tc:SAML:2.0:ac:classes:PasswordProtectedTransport</saml:AuthnContextClassRef></saml:AuthnContext></saml:AuthnStatement>` +
    `<saml:AttributeStatement>${attrs}</saml:AttributeStatement></saml:Assertion>`;
  const signedAssertion = sign(assertion, keys, 'Assertion');
  const response =
    `<samlp:Response ${ns} ID="_r${randomUUID()}" Version="2.0" IssueInstant="${t(0)}" Destination="${esc(input.acsUrl)}" InResponseTo="${esc(input.inResponseTo)}">` +
    `<saml:Issuer>${esc(input.idpEntityId)}</saml:Issuer>` +
    `<samlp:Status><samlp:StatusCode Value="urn:oasis:names:tc:SAML:2.0:status:Success"/></samlp:Status>` +
    `${signedAssertion}</samlp:Response>`;
  return sign(response, keys, 'Response');
}
