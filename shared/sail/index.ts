export * from '@/shared/sail/constants';
export * from '@/shared/sail/optics';
export * from '@/shared/sail/radiation-pressure';
export * from '@/shared/sail/sail-force';
export * from '@/shared/sail/performance';
export * from '@/shared/sail/materials';
