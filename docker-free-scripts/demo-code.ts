// npm run demo:code — prints the demo owner's current one-time code (the second factor the
// owner account must have), for trying the demo without an authenticator app. Demo only.
import { TOTP, Secret } from 'otpauth';
import { DEMO_OWNER_TOTP_SECRET } from '../lib/seed/foundation';

const totp = new TOTP({ algorithm: 'SHA1', digits: 6, period: 30, secret: Secret.fromBase32(DEMO_OWNER_TOTP_SECRET) });
const left = 30 - (Math.floor(Date.now() / 1000) % 30);
console.log(`${totp.generate()}  (owner@kestrel-plating.test; valid for about ${left} s more, and once)`);
