// The ES module build of maxrects-packer (its package points Node at a UMD build, and its type entry leaves out `Rectangle`).
declare module "maxrects-packer/dist/maxrects-packer.mjs" {
  export * from "maxrects-packer/dist/index";
}
