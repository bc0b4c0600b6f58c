// Two projects: node for shared/ and server/, jest-expo for components/.
const esmOnly = ['openid-client', 'oidc-provider', 'jose', 'oauth4webapi', 'quick-lru', 'nanoid'];
const alias = { '^@/(.*)$': '<rootDir>/$1' };
const transformIgnorePatterns = [`node_modules/(?!(${esmOnly.join('|')})/)`];
// d3-scale and d3-shape (with their d3 dependencies) ship ES modules only, as .mjs: the components project lets Babel compile them.
const chartModules = ['d3-[a-z-]+', 'internmap'];
const expoWeb = require('jest-expo/web/jest-preset');
const componentIgnorePatterns = expoWeb.transformIgnorePatterns.map((pattern) => pattern.replace('(?!(', `(?!(${chartModules.join('|')}|`));
const tsJest = {
  '^.+\\.[tj]sx?$': [
    'ts-jest',
    { tsconfig: { allowJs: true, module: 'commonjs', esModuleInterop: true, isolatedModules: true }, diagnostics: false },
  ],
};

module.exports = {
  projects: [
    {
      displayName: 'node',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/shared', '<rootDir>/tests/server'],
      testMatch: ['**/*.test.ts'],
      moduleNameMapper: alias,
      transform: tsJest,
      transformIgnorePatterns,
    },
    {
      displayName: 'components',
      preset: 'jest-expo/web',
      roots: ['<rootDir>/tests/components'],
      transform: { '^.+\\.mjs$': expoWeb.transform['\\.[jt]sx?$'] },
      transformIgnorePatterns: componentIgnorePatterns,
      testMatch: ['**/*.test.tsx', '**/*.test.ts'],
      moduleNameMapper: alias,
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      testMatch: ['**/*.test.ts'],
      moduleNameMapper: alias,
      transform: tsJest,
      transformIgnorePatterns,
    },
  ],
};
