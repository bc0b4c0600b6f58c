export * from '@/shared/sail/constants';
export * from '@/shared/sail/optics';
export * from '@/shared/sail/radiation-pressure';
export * from '@/shared/sail/atmosphere-density';
export * from '@/shared/sail/drag-crossover';
export * from '@/shared/sail/log-spiral';
export * from '@/shared/sail/materials';
export { linspace } from '@/shared/sail/numeric';
export * from '@/shared/sail/orbital-decay';
