// CLI: load the demo firm, its members and projects. Idempotent: rows that exist are kept
// as they are (nothing is duplicated or overwritten), missing ones are added.
//   node --import tsx --conditions=@basinwright/source seed/run.ts
import { ConfigError, getConfig } from '../api/src/config/env';
import { TAKEOFF_ELEMENTS } from '@basinwright/common';
import { DEMO_PASSWORD, demoFirms, demoPriceBook, demoReviewers } from './demo';
import { demoDesigns } from './designs';

async function main(): Promise<number> {
  try {
    getConfig();
  } catch (error) {
    console.error(`seed: ${error instanceof ConfigError ? error.message : String(error)}`);
    return 1;
  }
  const { Design, Firm, PriceBook, PriceBookItem, Project, ReviewerCredential, sequelize, User } =
    await import('../api/src/models');
  const { hashPassword } = await import('../api/src/security');
  const { computeStoredStudy } = await import('../api/src/modules/designs/designs.service');
  const added: string[] = [];
  try {
    const allUsers = demoFirms.flatMap((d) => d.users);
    // Hash outside the transaction (bcrypt is slow), only for members that are missing.
    const existing = new Set(
      (
        await User.findAll({
          where: { email: allUsers.map((u) => u.email) },
          attributes: ['email'],
        })
      ).map((u) => u.email),
    );
    const hashes = new Map<string, string>();
    for (const user of allUsers) {
      if (!existing.has(user.email)) hashes.set(user.email, await hashPassword(DEMO_PASSWORD));
    }

    for (const { firm: demoFirm, users: demoUsers, projects: demoProjects } of demoFirms)
      await sequelize.transaction(async (transaction) => {
        let firm = await Firm.findOne({
          where: { name: demoFirm.name },
          order: [['createdAt', 'ASC']],
          transaction,
        });
        if (firm === null) {
          firm = await Firm.create({ ...demoFirm }, { transaction });
          added.push(`firm "${firm.name}"`);
        }
        const users = new Map<string, InstanceType<typeof User>>();
        for (const demo of demoUsers) {
          let user = await User.findOne({ where: { email: demo.email }, transaction });
          if (user === null) {
            const passwordHash = hashes.get(demo.email);
            if (passwordHash === undefined)
              throw new Error(`no password hash prepared for ${demo.email}`);
            user = await User.create({ ...demo, firmId: firm.id, passwordHash }, { transaction });
            added.push(`${demo.role} ${demo.email}`);
          }
          users.set(demo.email, user);
        }
        for (const { email, ...credential } of demoReviewers) {
          const user = users.get(email);
          if (user === undefined) continue;
          const found = await ReviewerCredential.findByPk(user.id, { transaction });
          if (found !== null) continue;
          await ReviewerCredential.create(
            { ...credential, userId: user.id, firmId: firm.id, markedById: user.id },
            { transaction },
          );
          added.push(`reviewer mark of ${email}`);
        }
        for (const demo of demoProjects) {
          const found = await Project.findOne({
            where: { firmId: firm.id, name: demo.name },
            transaction,
          });
          if (found !== null) continue;
          const { createdByEmail, ...fields } = demo;
          await Project.create(
            { ...fields, firmId: firm.id, createdById: users.get(createdByEmail)?.id ?? null },
            { transaction },
          );
          added.push(`project "${demo.name}"`);
        }
        for (const demo of demoDesigns) {
          const project = await Project.findOne({
            where: { firmId: firm.id, name: demo.projectName },
            transaction,
          });
          if (project === null) continue;
          const found = await Design.findOne({ where: { projectId: project.id }, transaction });
          if (found !== null) continue;
          await Design.create(
            {
              firmId: firm.id,
              projectId: project.id,
              input: demo.input,
              options: null,
              updatedById: project.createdById,
              // the result the server keeps on save, so the project page has figures to show
              ...computeStoredStudy(demo.input),
            },
            { transaction },
          );
          added.push(`design of "${demo.projectName}"`);
        }
        // the invented price book belongs to the main demo firm only
        if (firm.name === demoFirms[0]?.firm.name) {
          const book = await PriceBook.findOne({
            where: { firmId: firm.id, name: demoPriceBook.name },
            transaction,
          });
          if (book === null) {
            const { items, codeByKind, ...fields } = demoPriceBook;
            const takeoffMapping: Record<string, string> = {};
            for (const [kind, code] of Object.entries(codeByKind))
              for (const element of TAKEOFF_ELEMENTS) takeoffMapping[`${kind}.${element}`] = code;
            const made = await PriceBook.create(
              {
                ...fields,
                firmId: firm.id,
                takeoffMapping,
                createdById: users.get('estimator@harrow-lune.example')?.id ?? null,
              },
              { transaction },
            );
            await PriceBookItem.bulkCreate(
              items.map((item, position) => ({
                ...item,
                firmId: firm.id,
                priceBookId: made.id,
                currency: fields.currency,
                position,
              })),
              { transaction },
            );
            added.push(`price book "${demoPriceBook.name}"`);
          }
        }
      });
    if (added.length === 0) console.log('seed: demo data already present, nothing to add');
    for (const line of added) console.log(`seed: added ${line}`);
    console.log(
      `seed: sign in as ${allUsers.map((u) => u.email).join(', ')} with password "${DEMO_PASSWORD}"`,
    );
    return 0;
  } catch (error) {
    console.error(`seed: failed — ${error instanceof Error ? error.message : String(error)}`);
    return 1;
  } finally {
    await sequelize.close();
  }
}

process.exitCode = await main();
