export { equipmentRouter } from './equipment.routes';
export { equipmentExists } from './equipment.repository';
