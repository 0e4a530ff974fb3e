// Packaging with electron-builder 26. `npm run dist` builds the renderer and the Electron bundles,
// then this packs them with Electron's own binary (downloaded by electron-builder) and rebuilds
// better-sqlite3 against Electron's headers so its .node file matches Electron's ABI.
/** @type {import('electron-builder').Configuration} */
module.exports = {
  appId: 'local.workshop.ignition-planner',
  productName: 'Ignition Planner',
  executableName: 'ignition-planner',
  copyright: 'Invented demo data only.',
  directories: { output: 'release', buildResources: 'build' },
  // The app is the two build outputs and its manifest; production node_modules are added by
  // electron-builder's dependency collector (only better-sqlite3 is needed at run time: zod is
  // bundled into main.js and preload.cjs, React into the renderer build).
  files: [
    'dist/**/*',
    'dist-electron/**/*',
    '!dist-electron/**/*.map',
    'package.json',
    // Already inside the bundles, so not needed again as packages.
    '!**/node_modules/{react,react-dom,scheduler,zod}/**',
    // better-sqlite3's C sources and build leftovers: only lib/ and the compiled .node are used.
    '!**/node_modules/better-sqlite3/{deps,src}/**',
    '!**/node_modules/better-sqlite3/build/{deps,Release/obj,Release/obj.target,Release/.deps}/**',
    '!**/node_modules/better-sqlite3/build/Release/test_extension.node',
  ],
  extraMetadata: { main: 'dist-electron/main.js' },
  asar: true,
  // A native module cannot be loaded from inside an asar archive; Electron redirects the load
  // to app.asar.unpacked, where this puts the file.
  // The search's worker thread is started from a real file path too (electron/ipc/search-runner.ts).
  asarUnpack: ['**/node_modules/better-sqlite3/**/*.node', 'dist-electron/search-worker.js'],
  // better-sqlite3 in node_modules is built for Node's ABI; rebuild it for Electron's.
  npmRebuild: true,
  buildDependenciesFromSource: true,
  nodeGypRebuild: false,
  // Electron's fuses, flipped in the binary before signing (electron.build "Adding Electron Fuses").
  electronFuses: {
    runAsNode: false, // ELECTRON_RUN_AS_NODE cannot turn the app into a plain Node interpreter
    enableCookieEncryption: true,
    enableNodeOptionsEnvironmentVariable: false, // NODE_OPTIONS cannot inject code
    enableNodeCliInspectArguments: false, // --inspect cannot attach a debugger to the main process
    enableEmbeddedAsarIntegrityValidation: true, // a tampered app.asar is refused (macOS, Windows)
    onlyLoadAppFromAsar: true, // no loose app folder beside the archive is ever run instead
    // grantFileProtocolExtraPrivileges stays at its default: the page is loaded from file:// and
    // its module scripts need those privileges.
  },
  linux: {
    target: ['AppImage', 'deb'],
    category: 'Utility',
    icon: 'build/icons',
    synopsis: 'Plan and check an electronic ignition conversion',
    description: 'Keeps a local record of engines and parts, checks a proposed module, coil and ballast against the existing setup, and prints a wiring checklist.',
    desktop: {
      entry: {
        Name: 'Ignition Planner',
        Comment: 'Plan and check an electronic ignition conversion',
        Categories: 'Utility;Engineering;',
        Keywords: 'ignition;coil;ballast;dwell;wiring;',
        Terminal: 'false',
      },
    },
  },
  deb: { priority: 'optional' },
  win: { target: ['nsis'], icon: 'build/icons/512x512.png' },
  nsis: { oneClick: false, perMachine: false, allowToChangeInstallationDirectory: true },
  mac: { target: ['dmg'], category: 'public.app-category.utilities', hardenedRuntime: true, icon: 'build/icons/512x512.png' },
  dmg: { title: 'Ignition Planner' },
  publish: null,
};
