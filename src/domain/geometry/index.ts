export * from './vec3.ts';
export * from './box.ts';
