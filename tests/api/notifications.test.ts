import { createProposalNotifier } from '../../server/src/modules/notifications/proposal-notifications';
import type { EventUser, ProposalEvent } from '../../server/src/modules/proposals/proposal-events';
import { receivedMail, sharedSmtpWorker, waitFor } from '../support/mail';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

const PUBLIC_URL = 'https://thalpos.kestrel.example';

describe('proposal e-mail notifications', () => {
  let db: TestDatabase;
  const people: Record<string, EventUser> = {};
  let nextProposal = 900_000 + Math.floor(Math.random() * 90_000);
  const notify = createProposalNotifier({ publicUrl: PUBLIC_URL });

  beforeAll(async () => {
    db = await createTestDatabase();
    const rows = await db.pool.query(
      "select id, login, name, email from users where login like 'demo-%' or login = 'thalpos-system'",
    );
    for (const r of rows.rows) people[r.login] = r;
  });
  afterAll(() => db.drop());

  const base = (actor: string, author: string, participants: string[] = []) => ({
    proposalId: ++nextProposal,
    actorId: people[actor].id,
    actor: people[actor],
    author: people[author],
    title: 'ΔfH° of methane (g) from a new combustion measurement',
    participants: participants.map((p) => people[p]),
    at: new Date(),
  });

  /** Runs the sink in a transaction, as the proposals service does; returns the outbox rows. */
  async function emit(event: ProposalEvent) {
    await db.db.transaction((tx) => notify(tx, event));
    const rows = await db.pool.query(
      `select o.to_address, o.subject, o.text, o.event_kind, u.login
         from outbox_messages o left join users u on u.id = o.recipient_id
        where o.text like $1 order by u.login`,
      [`%/proposals/${event.proposalId}\n%`],
    );
    return rows.rows as {
      to_address: string;
      subject: string;
      text: string;
      event_kind: string;
      login: string;
    }[];
  }
  const logins = (rows: { login: string }[]) => rows.map((r) => r.login);

  it('tells every editor and admin with an address of a submitted proposal', async () => {
    const rows = await emit({
      ...base('demo-curator', 'demo-curator'),
      type: 'submitted',
      status: 'submitted',
      itemCount: 2,
    });
    // The system account is an editor without an address: skipped.
    expect(logins(rows)).toEqual(['demo-admin', 'demo-editor', 'demo-editor-2']);
    const helga = rows.find((r) => r.login === 'demo-editor')!;
    expect(helga.to_address).toBe('helga.brandt@kestrel.example');
    expect(helga.event_kind).toBe('proposal.submitted');
    expect(helga.subject).toBe(
      `Review requested: proposal #${nextProposal} — ΔfH° of methane (g) from a new combustion measurement`,
    );
    expect(helga.text).toContain('Priya Nandakumar submitted proposal');
    expect(helga.text).toContain('(2 items)');
    expect(helga.text).toContain(`Open the proposal: ${PUBLIC_URL}/proposals/${nextProposal}\n`);
    expect(helga.text).toContain(`${PUBLIC_URL}/settings`);
  });

  it('never writes to the one who acted: an editor’s own submission skips them', async () => {
    const rows = await emit({
      ...base('demo-editor', 'demo-editor'),
      type: 'submitted',
      status: 'submitted',
      itemCount: 1,
    });
    expect(logins(rows)).toEqual(['demo-admin', 'demo-editor-2']);
    expect(rows[0].text).toContain('(1 item)');
  });

  it('tells the proposer and the thread’s participants of a decision, with the comment', async () => {
    const rows = await emit({
      ...base('demo-editor', 'demo-curator', ['demo-editor-2', 'demo-editor', 'demo-reader']),
      type: 'decided',
      decision: 'request_changes',
      status: 'changes_requested',
      comment: 'Please state the uncertainty basis.\nThe source gives ±0.3 kJ/mol at k = 2.',
      commentId: 1,
      createdRevisionIds: [],
    });
    expect(logins(rows)).toEqual(['demo-curator', 'demo-editor-2', 'demo-reader']);
    const priya = rows.find((r) => r.login === 'demo-curator')!;
    expect(priya.subject).toMatch(/^Changes requested: proposal #\d+ — /);
    expect(priya.text).toContain('Helga Brandt asked for changes to proposal');
    expect(priya.text).toContain(
      '> Please state the uncertainty basis.\n> The source gives ±0.3 kJ/mol at k = 2.',
    );
    expect(priya.text).toContain('because you wrote this proposal');
    expect(rows.find((r) => r.login === 'demo-reader')!.text).toContain(
      'because you took part in the discussion',
    );
  });

  it('tells participants, not the commenter, of a comment', async () => {
    const rows = await emit({
      ...base('demo-curator', 'demo-curator', ['demo-editor']),
      type: 'commented',
      commentId: 2,
      body: 'Uncertainty basis added.',
    });
    expect(logins(rows)).toEqual(['demo-editor']);
    expect(rows[0].subject).toMatch(/^New comment: proposal #\d+/);
    expect(rows[0].text).toContain('Priya Nandakumar commented on proposal');
  });

  it('skips users who turned e-mail off or have no address', async () => {
    await db.pool.query(
      "update users set email_notifications = false where login = 'demo-editor-2'",
    );
    await db.pool.query("update users set email = null where login = 'demo-admin'");
    try {
      const rows = await emit({
        ...base('demo-curator', 'demo-curator'),
        type: 'submitted',
        status: 'submitted',
        itemCount: 1,
      });
      expect(logins(rows)).toEqual(['demo-editor']);
      const decided = await emit({
        ...base('demo-editor', 'demo-curator', ['demo-editor-2']),
        type: 'decided',
        decision: 'approve',
        status: 'approved',
        comment: 'Agrees with the other measurements.',
        commentId: 3,
        createdRevisionIds: [1],
      });
      expect(logins(decided)).toEqual(['demo-curator']);
      expect(decided[0].subject).toMatch(/^Approved: /);
      expect(decided[0].text).toContain('accepted and will appear in the next release');
    } finally {
      await db.pool.query(
        "update users set email_notifications = true where login = 'demo-editor-2'",
      );
      await db.pool.query(
        "update users set email = 'lena.sorensen@kestrel.example' where login = 'demo-admin'",
      );
    }
  });

  it('writes nothing when the event’s transaction rolls back', async () => {
    const event: ProposalEvent = {
      ...base('demo-curator', 'demo-curator'),
      type: 'submitted',
      status: 'submitted',
      itemCount: 1,
    };
    await expect(
      db.db.transaction(async (tx) => {
        await notify(tx, event);
        throw new Error('the submission failed');
      }),
    ).rejects.toThrow('the submission failed');
    const rows = await db.pool.query('select 1 from outbox_messages where text like $1', [
      `%/proposals/${event.proposalId}\n%`,
    ]);
    expect(rows.rowCount).toBe(0);
  });

  it('reaches the recipients through SMTP', async () => {
    // A fresh address, so this run's message is told apart from others on the shared fake.
    const address = `priya.${nextProposal}@kestrel.example`;
    await db.pool.query("update users set email = $1 where login = 'demo-curator'", [address]);
    await emit({
      ...base('demo-editor', 'demo-curator'),
      type: 'decided',
      decision: 'reject',
      status: 'rejected',
      comment: 'The source does not support this value.',
      commentId: 4,
      createdRevisionIds: [],
    });
    const { worker, apiUrl, close } = sharedSmtpWorker(db.db);
    try {
      await worker.runOnce();
      const [mail] = await waitFor(async () => {
        const got = await receivedMail(apiUrl, address);
        return got.length > 0 && got;
      });
      expect(mail.subject).toMatch(/^Rejected: proposal #\d+ — ΔfH° of methane/);
      expect(mail.text).toContain('Helga Brandt rejected proposal');
      expect(mail.text).toContain('> The source does not support this value.');
    } finally {
      close();
    }
  });
});
