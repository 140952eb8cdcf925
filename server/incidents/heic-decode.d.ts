/** heic-decode (libheif compiled to WebAssembly) ships no types; this is the part Nestkeeper uses. */
declare module 'heic-decode' {
  function decode(input: { buffer: Buffer | ArrayBuffer | Uint8Array }): Promise<{ width: number; height: number; data: Uint8ClampedArray }>;
  export default decode;
}
