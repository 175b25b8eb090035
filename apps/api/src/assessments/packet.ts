import type {
  AssessmentStatus,
  ExposureInput,
  PartB,
  SafetyPacket,
  SubstanceInput,
} from '@batchproof/shared';
import type { Database } from '../db/database';

/**
 * The safety-assessment packet of one formula version (Annex I Part A/B of Regulation (EC)
 * No 1223/2009): gathered from the database, hashed and laid out as a PDF.
 * SKELETON: filled in by the packet work.
 */

/** What the packet needs of the stored assessment. */
export interface AssessmentForPacket {
  id: string;
  versionId: string;
  status: AssessmentStatus;
  assessorName: string;
  exposure: ExposureInput | null;
  substances: SubstanceInput[];
  partB: PartB;
  signedAt: Date | null;
  signedByName: string | null;
  contentHash: string | null;
}

export async function loadSafetyPacket(
  _db: Database,
  _workshopId: string,
  _a: AssessmentForPacket,
  _now: Date = new Date(),
): Promise<SafetyPacket> {
  throw new Error('loadSafetyPacket is not built yet');
}

/** SHA-256 hex of the packet's canonical content. */
export function packetHash(_packet: SafetyPacket): string {
  throw new Error('packetHash is not built yet');
}

export async function renderPacketPdf(
  _packet: SafetyPacket,
  _opts: { draft: boolean },
): Promise<Buffer> {
  throw new Error('renderPacketPdf is not built yet');
}
