export { articlesRouter } from './articles.routes';
export { createArticle } from './articles.service';
