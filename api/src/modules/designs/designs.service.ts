import {
  ENGINE_VERSION,
  runStudy,
  toSI,
  type DesignSaveInput,
  type StudyInput,
  type StudyResult,
} from '@basinwright/common';
import { UniqueConstraintError } from 'sequelize';
import { StaleCopyError, validationError } from '../../errors';
import { calculateStudy } from '../calc/calc.service';
import { Design, Project, sequelize, User } from '../../models';
import { getProject } from '../projects/projects.service';
import { presentDesign } from './designs.presenter';

const updatedBy = { model: User, as: 'updatedBy', attributes: ['id', 'name'] };

/** The design of one of the firm's projects (null when none is saved yet). */
export async function getDesign(firmId: string, projectId: string): Promise<Design | null> {
  await getProject(firmId, projectId); // 404 for a missing or another firm's project
  return Design.findOne({ where: { firmId, projectId }, include: [updatedBy] });
}

/** What a saved design keeps of its study: the result (SI), the engine version and the time. */
export interface StoredStudy {
  result: StudyResult;
  engineVersion: string;
  computedAt: Date;
}

/** Runs the study on an input in its own units; throws the engine's error unchanged. */
export function computeStoredStudy(input: StudyInput): StoredStudy {
  return { result: runStudy(toSI(input)), engineVersion: ENGINE_VERSION, computedAt: new Date() };
}

/**
 * Saves the design after running the study on it, and keeps the result: input the engine cannot compute (a floor it
 * cannot find, a subcritical toe) is the engineer's to fix, so it answers 422 and nothing is saved.
 */
export async function saveDesign(
  firmId: string,
  projectId: string,
  userId: string,
  body: DesignSaveInput,
): Promise<Design> {
  const project = await getProject(firmId, projectId);
  if (body.input.units !== project.units) {
    throw validationError(
      { 'input.units': `This project works in ${project.units} units.` },
      `The design must use the project's units (${project.units}).`,
    );
  }
  // In the compute pool, off the event loop, within the time budget (calc.pool.ts); the
  // engine's refusal is a 422 filed under input.
  const study: StoredStudy = {
    result: await calculateStudy(body.input, 'input'),
    engineVersion: ENGINE_VERSION,
    computedAt: new Date(),
  };
  const stale = (current: Design) =>
    new StaleCopyError(
      body.revision == null
        ? 'This design has been saved before: reload it, then save your changes on the current copy.'
        : `Someone saved this design after you opened it (it is now at revision ${current.revision}). Reload it or compare before saving again.`,
      presentDesign(projectId, current),
    );
  let id: string;
  try {
    id = await sequelize.transaction(async (transaction) => {
      // The row lock makes saves of one design take turns: the second of two saves based on
      // the same revision finds it moved on and is refused with the current copy.
      const existing = await Design.findOne({
        where: { firmId, projectId },
        include: [updatedBy],
        transaction,
        // the design's row only (the author is an outer join)
        lock: { level: transaction.LOCK.UPDATE, of: Design },
      });
      if (existing !== null && existing.revision !== body.revision) throw stale(existing);
      const values = {
        input: body.input,
        options: body.options ?? null,
        updatedById: userId,
        ...study,
      };
      const saved = existing
        ? await existing.update({ ...values, revision: existing.revision + 1 }, { transaction })
        : await Design.create({ firmId, projectId, ...values }, { transaction });
      // The project list sorts by last change: saving a design is a change of the project.
      await Project.update(
        { updatedAt: new Date() },
        { where: { id: projectId, firmId }, transaction },
      );
      return saved.id;
    });
  } catch (error) {
    // Two first saves at once: the second meets the first's row (one design a project).
    if (error instanceof UniqueConstraintError) {
      const current = await Design.findOne({
        where: { firmId, projectId },
        include: [updatedBy],
        rejectOnEmpty: true,
      });
      throw stale(current);
    }
    throw error;
  }
  return Design.findOne({ where: { id, firmId }, include: [updatedBy], rejectOnEmpty: true });
}
