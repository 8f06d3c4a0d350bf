/**
 * A short list of the passwords most often found in breach lists (widely published "most
 * common passwords" tables), refused at sign-up. Compared case-insensitively.
 */
const COMMON = `123456 123456789 12345678 password qwerty123 qwerty1 111111 12345 1234567 123123 1234567890
000000 abc123 password1 iloveyou 1q2w3e4r 1q2w3e4r5t qwertyuiop 123321 654321 666666 987654321 555555 7777777
888888 11111111 qwerty 1qaz2wsx zaq12wsx passw0rd password123 welcome welcome1 sunshine princess football
baseball dragon monkey letmein trustno1 superman starwars master hello123 freedom whatever shadow michael
charlie donald jennifer jordan23 liverpool chelsea arsenal computer internet asdfghjk asdf1234 asdfasdf
zxcvbnm zxcvbnm1 qazwsx 123qwe 1234qwer qwer1234 pa$$word p@ssw0rd p@ssword admin123 administrator
changeme secret123 default letmein1 archery archery1 bullseye bullseye1 12341234 11223344 112233 121212
abcd1234 aa123456 a1b2c3d4 loveyou iloveyou1 summer2024 winter2024 summer2025 winter2025 summer2026 winter2026`;

export const COMMON_PASSWORDS: ReadonlySet<string> = new Set(COMMON.split(/\s+/).filter(Boolean));
