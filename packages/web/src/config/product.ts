export const PRODUCT_NAME = 'Limbus';
