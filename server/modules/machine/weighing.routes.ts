import { recordWeighingBody, type RecordWeighingBody } from '../../../src/domain/contracts/machine.ts';
import { compareWeighing, weighingFromLoadCells, type WeighingResult } from '../../../src/domain/mass/index.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { invalid, notFound } from '../../http/errors.ts';
import type { AppDeps } from '../../app.ts';
import { json, toWeighingView, type WeighingRow } from './machine.repository.ts';
import { machineMass } from './mass.service.ts';

/**
 * Weighings of whole sections: a single reading, or readings on load cells at known support points from
 * which the core derives mass and plan CoG by statics. The measured values govern; each answer carries the
 * comparison with the computed section so a large difference (missing parts) shows at once.
 */
export function weighingRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  return [
    route({
      method: 'get',
      path: '/sections/:sectionId/weighings',
      access: can('machine.read'),
      async handler(req) {
        const productionId = uuidParam(req, 'productionId');
        const sectionId = uuidParam(req, 'sectionId');
        if (!(await db('machine_sections').where({ id: sectionId, production_id: productionId }).first('id'))) throw notFound('The section');
        const rows = await db<WeighingRow>('machine_weighings')
          .where({ production_id: productionId, section_id: sectionId })
          .orderBy([{ column: 'weighed_on', order: 'desc' }, { column: 'created_at', order: 'desc' }]);
        return { weighings: rows.map(toWeighingView) };
      },
    }),
    route({
      method: 'post',
      path: '/sections/:sectionId/weighings',
      access: can('machine.edit'),
      body: recordWeighingBody,
      async handler(req, res) {
        const productionId = uuidParam(req, 'productionId');
        const sectionId = uuidParam(req, 'sectionId');
        if (!(await db('machine_sections').where({ id: sectionId, production_id: productionId }).first('id'))) throw notFound('The section');
        const b = req.body as RecordWeighingBody;
        let derived: WeighingResult;
        try {
          derived = weighingFromLoadCells(b.readings);
        } catch (e) {
          throw invalid((e as Error).message, [{ path: 'readings', message: (e as Error).message }]);
        }
        const [row] = await db('machine_weighings')
          .insert({
            production_id: productionId,
            section_id: sectionId,
            weighed_on: b.weighedOn,
            weighed_by: b.weighedBy,
            scale: b.scale ?? '',
            readings: json(b.readings),
            mass_kg: derived.massKg,
            cog_plan_mm: json(derived.cogPlanMm),
            derived_notes: json(derived.notes),
            notes: b.notes ?? '',
            recorded_by: req.actor!.userId,
          })
          .returning('*');
        const computed = (await machineMass(db, productionId)).sections[sectionId];
        const comparison = computed && computed.massKg >= 0 ? compareWeighing({ massKg: computed.massKg, cogMm: computed.cogMm }, derived) : null;
        res.status(201).json({ weighing: toWeighingView(row as WeighingRow), comparison });
      },
    }),
    route({
      method: 'delete',
      path: '/weighings/:weighingId',
      access: can('machine.edit'),
      async handler(req) {
        const n = await db('machine_weighings').where({ id: uuidParam(req, 'weighingId'), production_id: uuidParam(req, 'productionId') }).delete();
        if (!n) throw notFound('The weighing');
      },
    }),
  ];
}
