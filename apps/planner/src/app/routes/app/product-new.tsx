import { ProductNewPage } from '@/features/products';

export default function ProductNewRoute() {
  return <ProductNewPage />;
}
