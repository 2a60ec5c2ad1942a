import { catalogueLists } from './catalogue.server';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = () => catalogueLists();
