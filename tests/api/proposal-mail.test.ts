import { receivedMail, sharedSmtpWorker, waitFor } from '../support/mail';
import { as, sourceId, submitted, valueItem, type Curator } from '../support/proposals';
import { createTestApp, type TestApp } from '../support/test-app';

// The proposals API and the e-mail outbox together: each event's messages are written in the
// event's transaction and reach the fake SMTP server through the worker.
describe('proposal events by e-mail, through the API', () => {
  const PUBLIC_URL = 'https://thalpos.kestrel.example';
  let t: TestApp;
  let curator: Curator, editor: Curator, editor2: Curator;
  let source: string;
  const priya = `priya.${Date.now()}.${process.pid}@kestrel.example`;

  beforeAll(async () => {
    t = await createTestApp({ PUBLIC_URL });
    [curator, editor, editor2] = await Promise.all(
      ['demo-curator', 'demo-editor', 'demo-editor-2'].map((l) => as(t, l)),
    );
    source = await sourceId(t);
    await t.db.pool.query("update users set email = $1 where login = 'demo-curator'", [priya]);
  });
  afterAll(() => t.close());

  const outbox = async (proposalId: number) =>
    (
      await t.db.pool.query(
        `select u.login, o.event_kind, o.subject from outbox_messages o
           join users u on u.id = o.recipient_id
          where o.text like $1 order by o.id, u.login`,
        [`%${PUBLIC_URL}/proposals/${proposalId}\n%`],
      )
    ).rows as { login: string; event_kind: string; subject: string }[];

  it('mails editors on submit, the proposer on comments and decisions, and delivers it', async () => {
    const id = await submitted(curator, [valueItem(source)], 'Methane (g) from new calorimetry');
    expect((await outbox(id)).map((r) => [r.login, r.event_kind]).sort()).toEqual([
      ['demo-admin', 'proposal.submitted'],
      ['demo-editor', 'proposal.submitted'],
      ['demo-editor-2', 'proposal.submitted'],
    ]);

    await editor.post(`/api/v1/proposals/${id}/comments`, { body: 'Which basis?' }).expect(201);
    await editor2
      .post(`/api/v1/proposals/${id}/decision`, {
        decision: 'request_changes',
        comment: 'State the uncertainty basis, please.',
      })
      .expect(200);
    const later = (await outbox(id)).slice(3).map((r) => [r.login, r.event_kind]);
    // The commenter is a participant of the decision; nobody hears of their own action.
    expect(later).toEqual([
      ['demo-curator', 'proposal.commented'],
      ['demo-curator', 'proposal.decided'],
      ['demo-editor', 'proposal.decided'],
    ]);

    const { worker, apiUrl, close } = sharedSmtpWorker(t.db.db);
    try {
      while ((await worker.runOnce()).sent > 0);
      const mails = await waitFor(async () => {
        const got = await receivedMail(apiUrl, priya);
        return got.length >= 2 && got;
      });
      expect(mails.map((m) => m.subject).sort()).toEqual([
        `Changes requested: proposal #${id} — Methane (g) from new calorimetry`,
        `New comment: proposal #${id} — Methane (g) from new calorimetry`,
      ]);
      const decision = mails.find((m) => m.subject.startsWith('Changes requested'))!;
      expect(decision.text).toContain('Kwame Mensah asked for changes to proposal');
      expect(decision.text).toContain('> State the uncertainty basis, please.');
      expect(decision.text).toContain(`${PUBLIC_URL}/proposals/${id}`);
    } finally {
      close();
    }
  });

  it('sends nothing to a proposer who turned e-mail off', async () => {
    await curator.patch('/api/v1/me/settings', { emailNotifications: false }).expect(200);
    try {
      const id = await submitted(curator, [valueItem(source)], 'Quiet proposal');
      await editor.post(`/api/v1/proposals/${id}/comments`, { body: 'Noted' }).expect(201);
      const rows = await outbox(id);
      expect(rows.filter((r) => r.login === 'demo-curator')).toEqual([]);
      expect(rows.map((r) => r.event_kind)).toContain('proposal.submitted');
    } finally {
      await curator.patch('/api/v1/me/settings', { emailNotifications: true }).expect(200);
    }
  });
});
