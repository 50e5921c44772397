import { and, asc, desc, eq, inArray, isNull } from 'drizzle-orm';
import { db } from './db/client';
import { attachments, calculations, recordCalculations, records, seasons } from './db/schema';

/** A CSV test log attached to a record that links a calculation, with what the page needs to link a new run. */
export interface TestLog {
  attachmentId: string;
  url: string;
  fileName: string;
  recordId: string;
  recordTitle: string;
  recordUrl: string;
  recordVersion: number;
  recordSeasonIsCurrent: boolean;
  /** every calculation the record links now (a new link is added to these) */
  recordCalculationIds: string[];
}

/** CSV logs of the records linked to a calculation, newest record first (the latest test leads). */
export function testLogsForCalculation(calculationId: string): TestLog[] {
  const rows = db()
    .select({
      attachmentId: attachments.id,
      fileName: attachments.fileName,
      recordId: records.id,
      recordTitle: records.title,
      recordVersion: records.version,
      recordSeasonIsCurrent: seasons.isCurrent,
    })
    .from(recordCalculations)
    .innerJoin(records, eq(records.id, recordCalculations.recordId))
    .innerJoin(seasons, eq(seasons.id, records.seasonId))
    .innerJoin(attachments, eq(attachments.recordId, records.id))
    .where(
      and(
        eq(recordCalculations.calculationId, calculationId),
        isNull(records.deletedAt),
        eq(attachments.contentType, 'text/csv'),
      ),
    )
    .orderBy(desc(records.createdAt), asc(attachments.fileName))
    .all();
  if (rows.length === 0) return [];
  const recordIds = [...new Set(rows.map((r) => r.recordId))];
  const links = db()
    .select({ recordId: recordCalculations.recordId, calculationId: recordCalculations.calculationId })
    .from(recordCalculations)
    .innerJoin(calculations, eq(calculations.id, recordCalculations.calculationId))
    .where(and(inArray(recordCalculations.recordId, recordIds), isNull(calculations.deletedAt)))
    .all();
  return rows.map((r) => ({
    ...r,
    url: `/api/attachments/${r.attachmentId}`,
    recordUrl: `/records/${r.recordId}`,
    recordCalculationIds: links.filter((l) => l.recordId === r.recordId).map((l) => l.calculationId),
  }));
}
