export * from '@/shared/budget/types';
export * from '@/shared/budget/presets';
export * from '@/shared/budget/validate-preset';
export * from '@/shared/budget/allowance';
export * from '@/shared/budget/rollup';
export * from '@/shared/budget/craft-table';
