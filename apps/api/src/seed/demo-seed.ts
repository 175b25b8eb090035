import bcrypt from 'bcryptjs';
import { asc, eq, inArray, sql } from 'drizzle-orm';
import { demoMembers, demoWorkshop } from './hollowmere';
import { BCRYPT_COST } from '../auth/auth-domain';
import type { Database } from '../db/database';
import { memberships, users, workshops } from '../db/schema';
import { demoAssessmentEmails, seedDemoAssessments } from './demo-assessment-seed';
import { seedDemoLabels } from './demo-label-seed';
import { seedDemoProduction } from './demo-production-seed';
import { demoOwner, seedDemoWorkspace } from './demo-workspace-seed';

/**
 * Seeds the demo workshop once. On later runs it only makes sure the demo users' passwords match
 * `password` (so a changed DEMO_PASSWORD takes effect), and otherwise leaves the data alone. A
 * password is hashed only when it is stored: a start with nothing changed costs one comparison.
 */
export async function seedDemo(
  db: Database,
  password: string,
): Promise<'created' | 'updated' | 'unchanged'> {
  const emails = [...demoMembers.map((m) => m.email), ...demoAssessmentEmails];
  // One row per membership of a demo user; the demo workshop's come first.
  const existing = await db
    .select({
      passwordHash: users.passwordHash,
      workshopId: memberships.workshopId,
      role: memberships.role,
    })
    .from(users)
    .innerJoin(memberships, eq(memberships.userId, users.id))
    .innerJoin(workshops, eq(workshops.id, memberships.workshopId))
    .where(inArray(users.email, emails))
    .orderBy(sql`${workshops.name} = ${demoWorkshop.name} desc`, asc(memberships.createdAt));
  if (existing.length === 0) {
    const passwordHash = await bcrypt.hash(password, BCRYPT_COST);
    const workshopId = await db.transaction(async (tx) => {
      const [workshop] = await tx.insert(workshops).values({ name: demoWorkshop.name }).returning();
      const created = await tx
        .insert(users)
        .values(demoMembers.map(({ role: _role, ...m }) => ({ ...m, passwordHash })))
        .returning({ id: users.id, email: users.email });
      await tx.insert(memberships).values(
        demoMembers.map((m) => ({
          workshopId: workshop!.id,
          userId: created.find((u) => u.email === m.email)!.id,
          role: m.role,
        })),
      );
      return workshop!.id;
    });
    await seedDemoWorkspace(db, workshopId);
    await seedProduction(db, workshopId);
    await seedDemoAssessments(db, workshopId);
    return 'created';
  }
  // A demo database created before the workspace existed gets its materials and formulas once.
  await seedDemoWorkspace(db, existing[0]!.workshopId);
  // A demo database seeded before labels existed gets its address and product identities once.
  await seedDemoLabels(db, existing[0]!.workshopId);
  // …and its production history once batches exist.
  await seedProduction(db, existing[0]!.workshopId);
  // …and the safety-assessment story (a second workshop for the assessor) once assessments exist.
  await seedDemoAssessments(db, existing[0]!.workshopId);
  const owner = existing.find((u) => u.role === 'owner') ?? existing[0]!;
  if (await bcrypt.compare(password, owner.passwordHash)) return 'unchanged';
  const passwordHash = await bcrypt.hash(password, BCRYPT_COST);
  await db.update(users).set({ passwordHash }).where(inArray(users.email, emails));
  return 'updated';
}

/** The production history, seeded as the workshop's owner. */
async function seedProduction(db: Database, workshopId: string) {
  const owner = await demoOwner(db, workshopId);
  if (owner) await seedDemoProduction(db, owner);
}
