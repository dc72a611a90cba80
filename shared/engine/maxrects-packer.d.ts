// maxrects-packer 2.7.4 ships its ESM build without a declaration file; the engine imports that
// build (its main entry is UMD) and takes the types from the package's main declarations.
declare module 'maxrects-packer/dist/maxrects-packer.mjs' {
  export * from 'maxrects-packer';
}
