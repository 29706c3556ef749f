// The package ships no types: one function, true when the password is on its list.
declare module 'fxa-common-password-list' {
  const list: { test(password: string): boolean };
  export default list;
}
