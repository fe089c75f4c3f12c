import { Router } from 'express';
import type { DataSource } from 'typeorm';
import type { MailSettings } from '../../mail/mailer';
import { addCoDriverInputSchema, createCarInputSchema, updateCarInputSchema, type CreateCarInput, type UpdateCarInput } from '@shared/season/car.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import { addCoDriver, createCar, deleteCar, getCar, listCars, removeCoDriver, updateCar } from './car.service';

export function carRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router();
  router.use(requireAuth);
  const carParam = validate({ params: idParam('carId') });

  router.post('/', validate({ body: createCarInputSchema }), async (req, res) => {
    const { car, created } = await createCar(ds, currentUser(req), parsed<CreateCarInput>(res, 'body'));
    res.status(created ? 201 : 200).json(car);
  });

  router.get('/', async (req, res) => {
    res.json(list(await listCars(ds, currentUser(req))));
  });

  router.get('/:carId', carParam, async (req, res) => {
    res.json(await getCar(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId));
  });

  router.patch('/:carId', validate({ params: idParam('carId'), body: updateCarInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    res.json(await updateCar(ds, currentUser(req), carId, parsed<UpdateCarInput>(res, 'body')));
  });

  router.delete('/:carId', carParam, async (req, res) => {
    await deleteCar(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId);
    res.status(204).end();
  });

  router.post('/:carId/co-drivers', validate({ params: idParam('carId'), body: addCoDriverInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    res.status(201).json(await addCoDriver(ds, mail, currentUser(req), carId, parsed<{ email: string }>(res, 'body').email));
  });

  router.delete('/:carId/co-drivers/:userId', validate({ params: idParam('carId', 'userId') }), async (req, res) => {
    const { carId, userId } = parsed<{ carId: string; userId: string }>(res, 'params');
    await removeCoDriver(ds, currentUser(req), carId, userId);
    res.status(204).end();
  });

  return router;
}
