import { Router } from 'express';
import { currentUser } from '../auth/principal.js';
import { permissionsOf } from '../auth/permissions.js';

export function meRouter() {
  const router = Router();
  router.get('/', (req, res) => {
    const user = currentUser(req.principal);
    res.json({ user: { name: user.name, email: user.email }, role: user.role, permissions: permissionsOf(user.role) });
  });
  return router;
}
