// Needed by the jest-expo/web preset; Metro uses babel-preset-expo on its own.
module.exports = function (api) {
  api.cache(true);
  return { presets: ['babel-preset-expo'] };
};
