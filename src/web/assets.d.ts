// What a Vite `?url` import is to TypeScript: the emitted asset's URL (the page's DWG reader imports its WebAssembly
// module so); declared here because the project's type check does not load Vite's client types.
declare module '*?url' {
  const url: string;
  export default url;
}
