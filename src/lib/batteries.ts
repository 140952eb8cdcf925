/** Lithium-ion battery watt-hours and shipping class (shared/batteries/shipping-class.ts). */
export { formatWattHours, wattHours, shippingClass, shippingClassText } from '../../shared/batteries/shipping-class';
export type { ShippingClass } from '../../shared/batteries/shipping-class';
