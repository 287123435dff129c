import { useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  CreateAddOnBody,
  CreateAssemblyBody,
  CreateMaterialBody,
  CreatePartLineBody,
  CreateSectionBody,
  MoveBody,
  RecordWeighingBody,
  UpdateAddOnBody,
  UpdateAssemblyBody,
  UpdateMachineBody,
  UpdateMaterialBody,
  UpdatePartLineBody,
  UpdateSectionBody,
} from '@domain/contracts/machine.ts';
import { api } from '../../../lib/api.ts';
import { machineKeys, machinePath } from './keys.ts';

/**
 * Every change to the machine, as one mutation type: after any of them the whole machine cache is refreshed
 * (sections, mass, breakdown), because one move changes many figures. A stale save answers 409 with the
 * current record in `error.current`; screens offer "reload" or "keep mine".
 */
export type MachineChange =
  | { kind: 'machine'; body: UpdateMachineBody }
  | { kind: 'createSection'; body: CreateSectionBody }
  | { kind: 'updateSection'; id: string; body: UpdateSectionBody }
  | { kind: 'deleteSection'; id: string }
  | { kind: 'createAddOn'; sectionId: string; body: CreateAddOnBody }
  | { kind: 'updateAddOn'; id: string; body: UpdateAddOnBody }
  | { kind: 'deleteAddOn'; id: string }
  | { kind: 'createMaterial'; body: CreateMaterialBody }
  | { kind: 'updateMaterial'; id: string; body: UpdateMaterialBody }
  | { kind: 'deleteMaterial'; id: string }
  | { kind: 'createAssembly'; body: CreateAssemblyBody }
  | { kind: 'updateAssembly'; id: string; body: UpdateAssemblyBody }
  | { kind: 'deleteAssembly'; id: string; withContents: boolean }
  | { kind: 'createLine'; body: CreatePartLineBody }
  | { kind: 'updateLine'; id: string; body: UpdatePartLineBody }
  | { kind: 'deleteLine'; id: string }
  | { kind: 'move'; body: MoveBody }
  | { kind: 'weighing'; sectionId: string; body: RecordWeighingBody }
  | { kind: 'deleteWeighing'; id: string };

export function sendChange(productionId: string, c: MachineChange): Promise<unknown> {
  const p = (path: string) => machinePath(productionId, path);
  const id = 'id' in c ? encodeURIComponent(c.id) : '';
  switch (c.kind) {
    case 'machine':
      return api.patch(p(''), c.body);
    case 'createSection':
      return api.post(p('/sections'), c.body);
    case 'updateSection':
      return api.patch(p(`/sections/${id}`), c.body);
    case 'deleteSection':
      return api.delete(p(`/sections/${id}`));
    case 'createAddOn':
      return api.post(p(`/sections/${encodeURIComponent(c.sectionId)}/add-ons`), c.body);
    case 'updateAddOn':
      return api.patch(p(`/add-ons/${id}`), c.body);
    case 'deleteAddOn':
      return api.delete(p(`/add-ons/${id}`));
    case 'createMaterial':
      return api.post(p('/materials'), c.body);
    case 'updateMaterial':
      return api.patch(p(`/materials/${id}`), c.body);
    case 'deleteMaterial':
      return api.delete(p(`/materials/${id}`));
    case 'createAssembly':
      return api.post(p('/assemblies'), c.body);
    case 'updateAssembly':
      return api.patch(p(`/assemblies/${id}`), c.body);
    case 'deleteAssembly':
      return api.delete(p(`/assemblies/${id}${c.withContents ? '?withContents=true' : ''}`));
    case 'createLine':
      return api.post(p('/lines'), c.body);
    case 'updateLine':
      return api.patch(p(`/lines/${id}`), c.body);
    case 'deleteLine':
      return api.delete(p(`/lines/${id}`));
    case 'move':
      return api.post(p('/move'), c.body);
    case 'weighing':
      return api.post(p(`/sections/${encodeURIComponent(c.sectionId)}/weighings`), c.body);
    case 'deleteWeighing':
      return api.delete(p(`/weighings/${id}`));
  }
}

export function useMachineChange(productionId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (change: MachineChange) => sendChange(productionId, change),
    onSettled: () => queryClient.invalidateQueries({ queryKey: machineKeys.all(productionId) }),
  });
}

