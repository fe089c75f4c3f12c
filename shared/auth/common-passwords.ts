// Passwords of 12 or more characters that head the public breach-corpus lists
// (for example the UK NCSC "PwnedPasswordsTop100k" list and SecLists'
// Common-Credentials). Shorter ones are refused by the length rule already.
// Compared case-insensitively. Chosen from memory of those lists, not copied.
const COMMON = [
  '123456789012', '1234567890123', '12345678901234', '123456789012345', '1234567890qwerty',
  '1q2w3e4r5t6y', '1q2w3e4r5t6y7u', '1qaz2wsx3edc', '1qaz2wsx3edc4rfv', 'zaq12wsxcde3',
  'qwertyuiop12', 'qwertyuiop123', 'qwertyuiopasdfgh', 'qwerty123456', 'qwerty1234567',
  'qwertyuiopasdfghjkl', 'asdfghjkl123', 'asdfghjklqwerty', 'zxcvbnm12345', 'qazwsxedcrfv',
  'password1234', 'password12345', 'password123456', 'passwordpassword', 'password1234567',
  'mypassword123', 'iloveyou1234', 'iloveyou12345', 'iloveyouforever', 'abc123456789',
  'abcdefghijkl', 'abcdefghijklm', 'abcd12345678', 'aaaaaaaaaaaa', '111111111111',
  '000000000000', '999999999999', '123123123123', '123321123321', '987654321098',
  '098765432109', 'welcome12345', 'welcome123456', 'letmein12345', 'letmein123456',
  'changeme1234', 'changeme12345', 'administrator', 'administrator1', 'adminadmin123',
  'football1234', 'baseball1234', 'basketball12', 'superman1234', 'starwars1234',
  'sunshine1234', 'princess1234', 'liverpool123', 'chelsea12345', 'manchester12',
  'trustno11234', 'monkey123456', 'dragon123456', 'master123456', 'shadow123456',
  'michael12345', 'jennifer1234', 'computer1234', 'internet1234', 'whatever1234',
  'blink182blink', 'correcthorsebatterystaple', 'thequickbrownfox', 'qwertyqwerty',
  'passw0rd1234', 'p@ssw0rd1234', 'p@ssword1234', 'pa$$word1234', 'summer2024!!',
  'welcome2024!', 'spring2025!!', 'autumn2025!!', 'winter2026!!', 'racecar12345',
];

const SET = new Set(COMMON.map((p) => p.toLowerCase()));

export function isCommonPassword(password: string): boolean {
  return SET.has(password.toLowerCase());
}
