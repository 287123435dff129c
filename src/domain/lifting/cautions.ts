/**
 * The cautions that go with every lifting verdict, by hand or by hoist. They are attached to every
 * result object so that no screen or printout can show a verdict without them.
 */
export const LIFTING_CAUTIONS: readonly string[] = [
  'Never stand or pass under a suspended load.',
  'Masses and centres of gravity are estimates until the item has been weighed.',
  'Rigging and lifting gear must be inspected before use and used by a competent person.',
  'Local codes, regulations and licensed practice prevail over these figures.',
];

/** Extra cautions for manual handling verdicts. */
export const HANDLING_CAUTIONS: readonly string[] = [
  'These figures screen a task; they are not a safe limit for every person. Above them, or for anyone at particular risk, make a fuller assessment.',
  'Team lifts need one person calling the lift, a clear route and enough room for everyone.',
];

/** A fresh copy of the cautions for a manual handling verdict. */
export function handlingCautions(): string[] {
  return [...LIFTING_CAUTIONS, ...HANDLING_CAUTIONS];
}

/** A fresh copy of the cautions for a lift plan. */
export function liftPlanCautions(): string[] {
  return [
    ...LIFTING_CAUTIONS,
    'Keep the exclusion zone clear of people for the whole lift, including set-down.',
    'A CoG outside its stated uncertainty, or a mass above its contingency, invalidates this plan.',
  ];
}
