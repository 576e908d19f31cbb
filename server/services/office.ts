/** The office this installation serves (one per installation for now). */
import { Office } from '../models/index';
import { HttpError } from '../middleware/errors';

/** The office, or a 503 telling the operator to seed or set one up. */
export async function theOffice(): Promise<Office> {
  const office = await Office.findOne({ order: [['createdAt', 'ASC']] });
  if (!office) throw new HttpError(503, 'not-configured', 'No office is set up yet. Run the seed (npx tsx server/db/seed.ts) or create one.');
  return office;
}
