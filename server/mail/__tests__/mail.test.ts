import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { startFakeSmtp, type FakeSmtp, type ReceivedMail } from "../fake-smtp";
import { createMailer, type Mailer } from "../mailer";
import { invitationMail } from "../templates/invitation";
import { RESULTS_CAUTION } from "../templates/layout";
import { passwordResetMail } from "../templates/password-reset";
import { returnedMail } from "../templates/returned";
import { reviewRequestedMail } from "../templates/review-requested";
import { signedMail } from "../templates/signed";

let fake: FakeSmtp;
let mailer: Mailer;
let inbox: ReceivedMail[] = [];
let failStore = false;

beforeAll(async () => {
  fake = await startFakeSmtp({
    port: 0,
    store: (mail) => {
      if (failStore) throw new Error("database unavailable");
      inbox.push(mail);
    },
  });
  const from = "Stillspan <no-reply@stillspan.test>";
  mailer = createMailer({ host: fake.host, port: fake.port, from, ignoreTLS: true });
});
afterAll(async () => {
  mailer.close();
  await fake.close();
});
beforeEach(() => {
  inbox = [];
  failStore = false;
});

const expiresAt = new Date("2026-12-04T09:30:00Z");
const token = "q7Yb1kD9xWm3RrT5uVz8aLcE2fGhJ4nP6sU0oI_tK-w";

describe("fake SMTP server with the real mailer", () => {
  it("listens on a free loopback port", () => {
    expect(fake.host).toBe("127.0.0.1");
    expect(fake.port).toBeGreaterThan(0);
  });

  it("delivers an invitation with the one-time link and its expiry in both parts", async () => {
    const link = `http://127.0.0.1:3000/invitation/${token}`;
    const projectName = "Harrowmere Strait";
    const mail = invitationMail({ inviterName: "Ada Admin", projectName, role: "reviewer", link, expiresAt });
    await mailer.send({ to: "new.reviewer@stillspan.test", ...mail });

    expect(inbox).toHaveLength(1);
    const [m] = inbox;
    expect(m.from).toBe("no-reply@stillspan.test");
    expect(m.to).toEqual(["new.reviewer@stillspan.test"]);
    expect(m.subject).toBe("You are invited to Harrowmere Strait on Stillspan");
    expect(m.text).toContain(link);
    expect(m.html).toContain(`href="${link}"`);
    for (const part of [m.text, m.html!]) expect(part).toContain("4 December 2026, 09:30 UTC");
    expect(m.text).toMatch(/72 hours/);
    expect(m.sizeBytes).toBeGreaterThan(m.text.length);
    expect(m.receivedAt).toBeInstanceOf(Date);
  });

  it("delivers a review request to the reviewer with the revision and the caution", async () => {
    const link = "http://127.0.0.1:3000/revisions/r-3";
    const mail = reviewRequestedMail({
      reviewerName: "Rhea Reviewer",
      analystName: "Arno Analyst",
      projectName: "Harrowmere Strait",
      alternativeName: "Alternative A",
      studyName: "2-DOF flutter check",
      revisionNumber: 3,
      note: "Damping of T1 lowered to 0.4 %.",
      link,
    });
    await mailer.send({ to: "reviewer@stillspan.test", ...mail });

    const [m] = inbox;
    expect(m.to).toEqual(["reviewer@stillspan.test"]);
    expect(m.subject).toBe("Review requested: 2-DOF flutter check, revision 3");
    expect(m.text).toContain("> Damping of T1 lowered to 0.4 %.");
    expect(m.text).toContain(link);
    expect(m.html).toContain(`href="${link}"`);
    expect(m.text).toContain(RESULTS_CAUTION);
    expect(m.html).toContain("wind-tunnel verification");
  });

  it("delivers a returned notice to the analyst with the reviewer's comments, HTML-escaped", async () => {
    const comments = "Check <A2*> beyond Ur = 12:\nthe table stops there & the curve is extrapolated.";
    const mail = returnedMail({
      analystName: "Arno Analyst",
      reviewerName: "Rhea Reviewer",
      projectName: "Harrowmere Strait",
      studyName: "2-DOF flutter check",
      revisionNumber: 3,
      comments,
      link: "http://127.0.0.1:3000/revisions/r-3",
    });
    await mailer.send({ to: ["analyst@stillspan.test"], ...mail });

    const [m] = inbox;
    expect(m.to).toEqual(["analyst@stillspan.test"]);
    expect(m.subject).toBe("Returned with comments: 2-DOF flutter check, revision 3");
    expect(m.text).toContain("> Check <A2*> beyond Ur = 12:\n> the table stops there & the curve is extrapolated.");
    expect(m.html).toContain("Check &lt;A2*&gt; beyond Ur = 12:");
    expect(m.html).not.toContain("<A2*>");
    expect(m.text).toContain("http://127.0.0.1:3000/revisions/r-3");
  });

  it("delivers the signed notice to the analyst and every viewer, with the summary link", async () => {
    const link = "http://127.0.0.1:3000/summaries/sig-1";
    const mail = signedMail({
      reviewerName: "Rhea Reviewer",
      projectName: "Harrowmere Strait",
      alternativeName: "Alternative A",
      studyName: "2-DOF flutter check",
      revisionNumber: 3,
      signedAt: new Date("2026-12-01T09:30:00Z"),
      link,
    });
    await mailer.send({ to: ["analyst@stillspan.test", "viewer@stillspan.test", "owner.rep@stillspan.test"], ...mail });

    const [m] = inbox;
    expect(m.to).toEqual(["analyst@stillspan.test", "viewer@stillspan.test", "owner.rep@stillspan.test"]);
    expect(m.subject).toBe("Signed stability summary: 2-DOF flutter check, revision 3");
    expect(m.text).toContain(link);
    expect(m.html).toContain(`href="${link}"`);
    expect(m.text).toContain("1 December 2026, 09:30 UTC");
    expect(m.text).toContain("Caution: Results are indicative");
  });

  it("delivers a password reset with its one-time link and no other secret", async () => {
    const link = `http://127.0.0.1:3000/reset-password/${token}`;
    const mail = passwordResetMail({ recipientName: "Arno", link, expiresAt });
    await mailer.send({ to: "analyst@stillspan.test", ...mail });

    const [m] = inbox;
    expect(m.subject).toBe("Choose a new Stillspan password");
    expect(m.text).toContain(link);
    expect(m.html).toContain(`href="${link}"`);
    // The token appears only inside the link (once in text; in HTML as the button and the visible address).
    expect(m.text.split(token)).toHaveLength(2);
    expect(m.html!.split(token)).toHaveLength(4);
  });

  it("delivers from a mailer configured with a user name and password (as production settings would be)", async () => {
    const withAuth = createMailer({
      host: fake.host,
      port: fake.port,
      from: "no-reply@stillspan.test",
      ignoreTLS: true,
      user: "stillspan",
      password: "any",
    });
    try {
      await withAuth.send({ to: "analyst@stillspan.test", ...passwordResetMail({ link: "http://x/r/1", expiresAt }) });
    } finally {
      withAuth.close();
    }
    expect(inbox.map((m) => m.to)).toEqual([["analyst@stillspan.test"]]);
  });

  it("makes the sender fail when the fake cannot store the message (no silent loss)", async () => {
    failStore = true;
    await expect(
      mailer.send({ to: "analyst@stillspan.test", ...passwordResetMail({ link: "http://x/reset/1", expiresAt }) }),
    ).rejects.toThrow(/451|store/);
    expect(inbox).toHaveLength(0);
  });
});
