/**
 * Reads and checks the embedded PDF signature: the ByteRange and the PKCS#7
 * (detached, signed attributes) in /Contents. Checks that the byte ranges cover the
 * whole file except the signature itself, that the signed digest matches those bytes,
 * that the signer's RSA signature over the signed attributes holds, and reports the
 * signer certificate so the caller can look it up in the office key ring.
 */
import { createHash, createPublicKey, verify } from 'node:crypto';
import forge from 'node-forge';

/** Outcome of checking the embedded signature. */
export type EmbeddedSignatureCheck =
  | { ok: true; certDer: Buffer; signingTime: Date | null }
  | { ok: false; reason: string };

const OID_SIGNED_DATA = '1.2.840.113549.1.7.2';
const OID_MESSAGE_DIGEST = '1.2.840.113549.1.9.4';
const OID_SIGNING_TIME = '1.2.840.113549.1.9.5';
const DIGESTS: Record<string, string> = {
  '2.16.840.1.101.3.4.2.1': 'sha256',
  '2.16.840.1.101.3.4.2.2': 'sha384',
  '2.16.840.1.101.3.4.2.3': 'sha512',
};

/** Finds the last signature's ByteRange and the raw PKCS#7 bytes it leaves out. */
export function locateSignature(pdf: Buffer): { byteRange: [number, number, number, number]; pkcs7: Buffer } | null {
  const text = pdf.toString('latin1');
  const matches = [...text.matchAll(/\/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]/g)];
  const m = matches.at(-1);
  if (!m) return null;
  const byteRange = [Number(m[1]), Number(m[2]), Number(m[3]), Number(m[4])] as [number, number, number, number];
  const [, len1, start2] = byteRange;
  if (start2 <= len1 + 1 || start2 > pdf.length) return null;
  const hex = text.slice(len1, start2);
  if (!/^<[0-9a-fA-F]*>$/.test(hex)) return null;
  // The placeholder is padded with zeros after the DER blob; DER carries its own length.
  return { byteRange, pkcs7: Buffer.from(hex.slice(1, -1), 'hex') };
}

type Asn1 = forge.asn1.Asn1;
// node-forge accepts an options object here; its type declarations only know the older boolean.
const fromDer = forge.asn1.fromDer as unknown as (bytes: forge.util.ByteStringBuffer, options: { parseAllBytes: boolean; strict: boolean }) => Asn1;

function children(node: Asn1): Asn1[] {
  return Array.isArray(node.value) ? (node.value as Asn1[]) : [];
}

function isContext(node: Asn1, tag: number): boolean {
  return node.tagClass === forge.asn1.Class.CONTEXT_SPECIFIC && node.type === tag;
}

/** Verifies the embedded signature of a PDF's bytes as received. */
export function checkEmbeddedSignature(pdf: Buffer): EmbeddedSignatureCheck {
  const found = locateSignature(pdf);
  if (!found) return { ok: false, reason: 'The file carries no readable digital signature.' };
  const [start1, len1, start2, len2] = found.byteRange;
  if (start1 !== 0 || start2 + len2 !== pdf.length) {
    return { ok: false, reason: 'The digital signature does not cover the whole file: content was added or removed after signing.' };
  }
  const signedBytes = Buffer.concat([pdf.subarray(0, len1), pdf.subarray(start2, start2 + len2)]);

  let root: Asn1;
  try {
    root = fromDer(forge.util.createBuffer(found.pkcs7.toString('binary')), { parseAllBytes: false, strict: false });
  } catch {
    return { ok: false, reason: 'The digital signature block is damaged and cannot be read.' };
  }
  try {
    const [oidNode, wrapped] = children(root);
    if (forge.asn1.derToOid(oidNode.value as string) !== OID_SIGNED_DATA) return { ok: false, reason: 'The digital signature block is damaged or is not a signature.' };
    const signedData = children(wrapped)[0];
    const parts = children(signedData);
    const certNode = parts.find((p) => isContext(p, 0));
    const signerInfos = parts.at(-1)!;
    const signerInfo = children(signerInfos)[0];
    if (!signerInfo) return { ok: false, reason: 'The signature block names no signer.' };
    const si = children(signerInfo);
    const serialHex = forge.util.bytesToHex(children(si[1])[1].value as string).replace(/^0+/, '');
    const digestName = DIGESTS[forge.asn1.derToOid(children(si[2])[0].value as string)];
    if (!digestName) return { ok: false, reason: 'The signature uses a digest algorithm this office does not accept.' };
    const attrs = si.find((p) => isContext(p, 0));
    if (!attrs) return { ok: false, reason: 'The signature has no signed attributes.' };
    const digestNode = si.find((p) => p.tagClass === forge.asn1.Class.UNIVERSAL && p.type === forge.asn1.Type.OCTETSTRING);
    if (!digestNode) return { ok: false, reason: 'The signature block holds no signature value.' };
    const encryptedDigest = Buffer.from(digestNode.value as string, 'binary');

    let messageDigest: Buffer | null = null;
    let signingTime: Date | null = null;
    for (const attr of children(attrs)) {
      const [typeNode, valueSet] = children(attr);
      const oid = forge.asn1.derToOid(typeNode.value as string);
      const first = children(valueSet)[0];
      if (oid === OID_MESSAGE_DIGEST) messageDigest = Buffer.from(first.value as string, 'binary');
      if (oid === OID_SIGNING_TIME) {
        signingTime = first.type === forge.asn1.Type.UTCTIME ? forge.asn1.utcTimeToDate(first.value as string) : forge.asn1.generalizedTimeToDate(first.value as string);
      }
    }
    if (!messageDigest) return { ok: false, reason: 'The signature has no message digest.' };
    const actual = createHash(digestName).update(signedBytes).digest();
    if (!actual.equals(messageDigest)) return { ok: false, reason: 'The file content does not match its digital signature: it was changed after signing.' };

    const certs = certNode ? children(certNode).map((c) => forge.pki.certificateFromAsn1(c)) : [];
    const signer = certs.find((c) => c.serialNumber.replace(/^0+/, '') === serialHex);
    if (!signer) return { ok: false, reason: "The signer's certificate is missing from the signature." };
    // Signed attributes are signed as a SET, although stored with an implicit [0] tag.
    const attrsAsSet = forge.asn1.create(forge.asn1.Class.UNIVERSAL, forge.asn1.Type.SET, true, children(attrs));
    const attrsDer = Buffer.from(forge.asn1.toDer(attrsAsSet).getBytes(), 'binary');
    const publicKey = createPublicKey(forge.pki.publicKeyToPem(signer.publicKey));
    if (!verify(digestName, attrsDer, publicKey, encryptedDigest)) {
      return { ok: false, reason: 'The digital signature itself is invalid.' };
    }
    const certDer = Buffer.from(forge.asn1.toDer(forge.pki.certificateToAsn1(signer)).getBytes(), 'binary');
    return { ok: true, certDer, signingTime };
  } catch {
    return { ok: false, reason: 'The digital signature block is damaged and cannot be read.' };
  }
}
