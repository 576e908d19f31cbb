/** Reads an AuthnRequest sent with the HTTP-Redirect binding (base64 of raw-deflated XML). */
import { inflateRawSync } from 'node:zlib';
import { DOMParser } from '@xmldom/xmldom';

/** The parts of an AuthnRequest the fake IdP needs. */
export interface ParsedAuthnRequest { id: string; issuer: string | null; acsUrl: string | null }

/** Decodes and parses the SAMLRequest parameter; throws a readable error when it is not one. */
export function parseAuthnRequest(samlRequest: string): ParsedAuthnRequest {
  let xml: string;
  try {
    xml = inflateRawSync(Buffer.from(samlRequest, 'base64')).toString('utf8');
  } catch {
    throw new Error('SAMLRequest is not a deflated, base64-encoded message');
  }
  const doc = new DOMParser().parseFromString(xml, 'text/xml');
  const root = doc.documentElement;
  if (!root || root.localName !== 'AuthnRequest') throw new Error('SAMLRequest is not an AuthnRequest');
  const id = root.getAttribute('ID');
  if (!id) throw new Error('AuthnRequest has no ID');
  const issuer = root.getElementsByTagNameNS('urn:oasis:names:tc:SAML:2.0:assertion', 'Issuer')[0]?.textContent ?? null;
  return { id, issuer, acsUrl: root.getAttribute('AssertionConsumerServiceURL') };
}
