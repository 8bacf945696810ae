import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter, Router } from '@angular/router';

import { errorInterceptor } from '../../../core/error-interceptor';
import { Session } from '../../../core/session';
import type { UserRecord } from '../models/user-record';
import { UsersPage } from './users-page';

const users: UserRecord[] = [
  {
    id: 1,
    login: 'aokafor',
    name: 'Amara Okafor',
    role: 'admin',
    createdAt: '2026-01-12T09:30:00.000Z',
  },
  {
    id: 2,
    login: 'lvoss',
    name: 'Lena Voss',
    role: 'editor',
    createdAt: '2026-02-03T14:05:00.000Z',
  },
  {
    id: 3,
    login: 'mkaya',
    name: 'Merve Kaya',
    role: 'curator',
    createdAt: '2026-03-21T08:00:00.000Z',
  },
];

describe('UsersPage', () => {
  let fixture: ComponentFixture<UsersPage>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;
  let rootLoader: HarnessLoader;
  let session: { user: jest.Mock; refresh: jest.Mock };

  beforeEach(async () => {
    session = { user: jest.fn(() => users[0]), refresh: jest.fn() };
    TestBed.configureTestingModule({
      imports: [UsersPage],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: Session, useValue: session },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(UsersPage);
    loader = TestbedHarnessEnvironment.loader(fixture);
    rootLoader = TestbedHarnessEnvironment.documentRootLoader(fixture);
  });

  afterEach(() => backend.verify());

  async function loadUsers(list = users): Promise<void> {
    backend.expectOne({ method: 'GET', url: '/api/v1/users' }).flush({ users: list });
    await fixture.whenStable();
  }

  const roleSelect = (login: string) =>
    loader.getHarness(MatSelectHarness.with({ selector: `[aria-label="Role for ${login}"]` }));

  it('lists every user with login, name, role and creation date', async () => {
    await loadUsers();

    const table = await loader.getHarness(MatTableHarness);
    expect(await table.getHeaderRows().then((rows) => rows[0].getCellTextByIndex())).toEqual([
      'Login',
      'Name',
      'Role',
      'Created',
    ]);
    const cells = await table.getCellTextByColumnName();
    expect(cells['login'].text).toEqual(['aokafor', 'lvoss', 'mkaya']);
    expect(cells['name'].text).toEqual(['Amara Okafor', 'Lena Voss', 'Merve Kaya']);
    expect(cells['createdAt'].text).toEqual(['2026-01-12', '2026-02-03', '2026-03-21']);
    expect(await (await roleSelect('lvoss')).getValueText()).toBe('editor');
    expect(await (await roleSelect('mkaya')).getValueText()).toBe('curator');
  });

  it('saves a picked role with PATCH /api/v1/users/:id and confirms it', async () => {
    await loadUsers();

    const select = await roleSelect('mkaya');
    await select.open();
    await select.clickOptions({ text: 'editor' });

    const patch = backend.expectOne({ method: 'PATCH', url: '/api/v1/users/3' });
    expect(patch.request.body).toEqual({ role: 'editor' });
    patch.flush({ user: { ...users[2], role: 'editor' } });
    await fixture.whenStable();

    const snackBar = await rootLoader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toBe('Role of mkaya changed to editor');
    expect(await (await roleSelect('mkaya')).getValueText()).toBe('editor');
    expect(session.refresh).not.toHaveBeenCalled();
  });

  it("shows the server's refusal and puts the stored role back", async () => {
    await loadUsers();

    const select = await roleSelect('aokafor');
    await select.open();
    await select.clickOptions({ text: 'reader' });

    backend
      .expectOne({ method: 'PATCH', url: '/api/v1/users/1' })
      .flush(
        { error: { code: 'last_admin', message: 'The last admin cannot give up the admin role.' } },
        { status: 409, statusText: 'Conflict' },
      );
    await fixture.whenStable();

    const snackBar = await rootLoader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toBe(
      'Role of aokafor not changed: The last admin cannot give up the admin role.',
    );
    expect(await (await roleSelect('aokafor')).getValueText()).toBe('admin');
    expect(await (await roleSelect('aokafor')).isDisabled()).toBe(false);
  });

  it('reverts on 403 as well, and a later change still works from the stored role', async () => {
    await loadUsers();

    let select = await roleSelect('lvoss');
    await select.open();
    await select.clickOptions({ text: 'admin' });
    backend
      .expectOne('/api/v1/users/2')
      .flush(
        { error: { code: 'forbidden', message: 'Admins only.' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await fixture.whenStable();
    expect(await (await roleSelect('lvoss')).getValueText()).toBe('editor');

    select = await roleSelect('lvoss');
    await select.open();
    await select.clickOptions({ text: 'curator' });
    const retry = backend.expectOne('/api/v1/users/2');
    expect(retry.request.body).toEqual({ role: 'curator' });
    retry.flush({ user: { ...users[1], role: 'curator' } });
    await fixture.whenStable();
    expect(await (await roleSelect('lvoss')).getValueText()).toBe('curator');
  });

  it('sends an admin who demoted themselves back home once the session no longer says admin', async () => {
    session.refresh.mockResolvedValue({ ...users[0], role: 'editor', avatarUrl: null });
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    await loadUsers();

    const select = await roleSelect('aokafor');
    await select.open();
    await select.clickOptions({ text: 'editor' });
    backend.expectOne('/api/v1/users/1').flush({ user: { ...users[0], role: 'editor' } });
    await fixture.whenStable();
    await new Promise((resolve) => setTimeout(resolve));

    expect(session.refresh).toHaveBeenCalledTimes(1);
    expect(navigate).toHaveBeenCalledWith('/');
  });

  it('says why the list could not be loaded and loads it again on request', async () => {
    backend
      .expectOne('/api/v1/users')
      .flush(
        { error: { code: 'forbidden', message: 'Admins only.' } },
        { status: 403, statusText: 'Forbidden' },
      );
    await fixture.whenStable();

    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('Could not load the users: Admins only.');

    (alert?.querySelector('button') as HTMLButtonElement).click();
    await loadUsers();
    expect(await (await loader.getHarness(MatTableHarness)).getRows()).toHaveLength(3);
  });
});
