import { Router } from 'express';
import { passwordChangeSchema, personCreateSchema, personIdParamsSchema, personUpdateSchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { currentPerson } from '../auth/current-person';
import { allow, everyRole } from '../auth/guard';
import { setCookie } from '../auth/load-session';
import { validate } from '../http/validate-request';
import { changeOwnPassword } from './change-own-password.use-case';
import { createPerson } from './create-person.use-case';
import { listPeople } from './people.repository';
import { updatePerson } from './update-person.use-case';

/** People and roles (admin), and the self-service password change. */
export function peopleRouter({ dataSource, lucia }: ApiContext): Router {
  const router = Router();

  router.get('/api/people', allow('admin'), async (_req, res) => {
    res.json(await listPeople(dataSource.manager));
  });

  const createInput = validate({ body: personCreateSchema });
  router.post('/api/people', allow('admin'), createInput, async (_req, res) => {
    const person = await createPerson(dataSource, createInput.from(res).body);
    res.status(201).json(person);
  });

  const updateInput = validate({ params: personIdParamsSchema, body: personUpdateSchema });
  router.patch('/api/people/:id', allow('admin'), updateInput, async (_req, res) => {
    const { params, body } = updateInput.from(res);
    res.json(await updatePerson({ dataSource, lucia }, params.id, body));
  });

  const passwordInput = validate({ body: passwordChangeSchema });
  router.put('/api/me/password', allow(...everyRole), passwordInput, async (_req, res) => {
    const { sessionCookie } = await changeOwnPassword({ dataSource, lucia }, currentPerson(res), passwordInput.from(res).body);
    setCookie(res, sessionCookie);
    res.status(204).end();
  });

  return router;
}
