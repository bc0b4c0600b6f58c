// Expo's default Babel preset, written out: jest-expo's web preset transforms nothing without a Babel config file.
module.exports = function babelConfig(api) {
  api.cache(true);
  return { presets: ['babel-preset-expo'] };
};
