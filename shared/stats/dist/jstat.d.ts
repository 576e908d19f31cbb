declare module 'jstat' {
  // jstat ships no type declarations; the wrapper in ./index.ts is the only user.
  const jStat: any;
  export default jStat;
  export { jStat };
}
