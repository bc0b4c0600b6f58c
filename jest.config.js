// Two projects: node for shared/ and server/, jest-expo for components/.
const esmOnly = ['openid-client', 'oidc-provider', 'jose', 'oauth4webapi', 'quick-lru', 'nanoid'];
const alias = { '^@/(.*)$': '<rootDir>/$1' };
const transformIgnorePatterns = [`node_modules/(?!(${esmOnly.join('|')})/)`];
const tsJest = {
  '^.+\\.[tj]sx?$': ['ts-jest', { tsconfig: { allowJs: true, module: 'commonjs', esModuleInterop: true, isolatedModules: true }, diagnostics: false }],
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
