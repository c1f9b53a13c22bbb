import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CustomerDetailDto } from '@shared/schemas/records';
import type { CompanyDto } from '@shared/schemas/company';
import { bookingKeys } from './get-round';

/** The customer's sites with their appliances: the booking page offers every appliance at the chosen site. */
export const getBookingCustomer = (customerId: string) => api<CustomerDetailDto>(`/customers/${encodeURIComponent(customerId)}`);
export const bookingCustomerQueryOptions = (customerId: string) =>
  queryOptions({ queryKey: [...bookingKeys.all, 'customer', customerId], queryFn: () => getBookingCustomer(customerId), enabled: Boolean(customerId) });
export const useBookingCustomer = (customerId: string) => useQuery(bookingCustomerQueryOptions(customerId));

/** The company's window lengths by appliance kind (company settings). */
export const getBookingCompany = () => api<CompanyDto>('/company');
export const bookingCompanyQueryOptions = () => queryOptions({ queryKey: [...bookingKeys.all, 'company'], queryFn: getBookingCompany });
export const useBookingCompany = () => useQuery(bookingCompanyQueryOptions());
