import {
  ENGINE_VERSION,
  runStudy,
  toSI,
  type DesignSaveInput,
  type StudyInput,
  type StudyResult,
} from '@basinwright/common';
import { validationError } from '../../errors';
import { calculateStudy } from '../calc/calc.service';
import { Design, Project, sequelize, User } from '../../models';
import { getProject } from '../projects/projects.service';

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
  const id = await sequelize.transaction(async (transaction) => {
    const existing = await Design.findOne({
      where: { firmId, projectId },
      transaction,
      lock: true,
    });
    const values = {
      input: body.input,
      options: body.options ?? null,
      updatedById: userId,
      ...study,
    };
    const saved = existing
      ? await existing.update(values, { transaction })
      : await Design.create({ firmId, projectId, ...values }, { transaction });
    // The project list sorts by last change: saving a design is a change of the project.
    await Project.update(
      { updatedAt: new Date() },
      { where: { id: projectId, firmId }, transaction },
    );
    return saved.id;
  });
  return Design.findOne({ where: { id, firmId }, include: [updatedBy], rejectOnEmpty: true });
}
