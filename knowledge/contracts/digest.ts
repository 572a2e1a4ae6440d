/* The weekly digest to leads (GET /api/digest, POST /api/digest/send). */

export interface DigestCase {
  id: string;
  title: string;
  openDays: number;
  failedAttempts: number;
}

export interface DigestFix {
  id: string;
  title: string;
  /** the remedy that worked, as a short label */
  fix: string;
  verifiedAt: string;
}

export interface Digest {
  groupId: string;
  groupName: string;
  since: string;
  stubborn: DigestCase[];
  verified: DigestFix[];
  /** the leads and owners the digest goes to */
  recipients: string[];
}

export interface SentDigest extends Digest {
  sent: number;
}
