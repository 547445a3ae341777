import { type APIRequestContext, expect } from '@playwright/test';

/** One message as the development mailbox lists it at /dev/mail.json. */
interface DevMail {
  to: string[];
  subject: string;
  text: string;
}

/**
 * Waits until the SMTP fake has received a message for `to` containing an invitation link, and
 * returns the link's path (`/invite/<token>`), so the test follows it on its own base URL.
 */
export async function invitationPathFor(request: APIRequestContext, to: string): Promise<string> {
  let path = '';
  await expect
    .poll(
      async () => {
        const res = await request.get('/dev/mail.json');
        const { messages } = (await res.json()) as { messages: DevMail[] };
        const mail = [...messages].reverse().find((m) => m.to.some((t) => t.toLowerCase() === to.toLowerCase()));
        const match = mail?.text.match(/\/invite\/[A-Za-z0-9_-]+/);
        path = match?.[0] ?? '';
        return path;
      },
      { message: `an invitation e-mail to ${to}`, timeout: 15_000 },
    )
    .not.toBe('');
  return path;
}
