import bcrypt from 'bcrypt';
import type { DataSource } from 'typeorm';
import { Scoped } from '../db/scoped';
import { enqueueMail, mailTemplate } from '../notifications';
import { Organization } from '../organizations/organization.entity';
import { User } from '../users/user.entity';
import { DEMO_PASSWORD, demoFirm, otherFirm } from './demo-people';
import { seedDemoActivity } from './demo-activity';
import { seedDemoCalibration } from './demo-calibration';
import { seedDemoFleet } from './demo-fleet';
import { seedDemoRentals } from './demo-rentals';

/** Fill an empty database with the invented demo firms. Does nothing when any
 * organization exists, so a restart never duplicates or overwrites data. */
export async function seedDemoIfEmpty(db: DataSource, bcryptCost = 12): Promise<boolean> {
  if ((await db.getRepository(Organization).count()) > 0) return false;
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, bcryptCost);
  await db.transaction(async (manager) => {
    for (const firm of [demoFirm, otherFirm]) {
      const org = await manager.save(Organization, manager.create(Organization, { name: firm.name, timeZone: firm.timeZone, currency: firm.currency }));
      const tx = new Scoped(manager, org.id);
      for (const person of firm.people) await tx.insert(User, { ...person, passwordHash });
      if (firm === demoFirm) {
        await seedDemoFleet(tx, firm.timeZone, firm.name);
        await seedDemoActivity(tx, firm.timeZone);
        await seedDemoCalibration(tx, firm.name, firm.timeZone);
        await seedDemoRentals(tx, firm.timeZone);
      }
      const owner = firm.people.find((p) => p.role === 'owner')!;
      await enqueueMail(tx, [owner.email], welcomeMail, { firm: firm.name });
    }
  });
  return true;
}

/** The first mail a new firm's owner gets. */
const welcomeMail = mailTemplate<{ firm: string }>('welcome', {
  subject: 'Welcome to Nestkeeper, {{firm}}',
  heading: '{{firm}} is set up',
  body: `<p>Your firm's Nestkeeper is ready. Invite colleagues under Users: each gets a mail to choose their own name and password.
Anyone can change their password and turn on a second sign-in step under "My account".</p>
<p>This mailbox shows every e-mail Nestkeeper sends for {{firm}}, so you can see what your team and customers receive.
Under Settings → Mail, name the address replies to these mails should go to.</p>`,
});
