// A short list of the most common passwords (from widely published breach-frequency lists,
// recalled from memory; OWASP ASVS 6.2.4 asks that such passwords be refused).
const COMMON = new Set([
  '12345678', '123456789', '1234567890', 'password', 'password1', 'password12', 'password123', 'passw0rd',
  'qwertyui', 'qwerty123', 'qwertyuiop', '11111111', '00000000', '12341234', '87654321', 'iloveyou',
  'sunshine', 'princess', 'football', 'baseball', 'welcome1', 'welcome123', 'abc12345', 'abcd1234',
  'letmein1', 'trustno1', 'superman', 'starwars', 'whatever', 'dragon12', 'monkey12', 'michael1',
  'asdfghjk', 'asdfasdf', 'zaq12wsx', '1q2w3e4r', '1qaz2wsx', 'qazwsxedc', 'admin123', 'administrator',
  'changeme', 'secret12', 'computer', 'internet', 'shadow12', 'master12', 'jennifer', 'jordan23',
  'charlie1', 'aa123456', 'a1234567', 'q1w2e3r4', 'p@ssw0rd', 'p@ssword', 'password!', 'letmein123',
  'freedom1', 'mustang1', 'liverpool', 'chelsea1', 'samsung1', 'basketball', 'butterfly', 'chocolate',
  'elephant', 'november', 'december', 'sweetheart', 'iloveyou1', '123123123', '987654321', '11223344',
  '12121212', '55555555', '66666666', '88888888', '99999999', 'qwer1234', 'test1234', 'testtest',
]);

export function isCommonPassword(password: string): boolean {
  return COMMON.has(password.toLowerCase());
}
