import type { Config } from '../config/config';
import type { Db } from '../db/knex';
import type { QuoteRepository } from '../quotes/quote.repository';
import type { RequestRepository } from '../requests/request.repository';
import type { FlowService } from '../flow/flow.service';
import { ChangeOrderRepository } from '../change-orders/change-order.repository';
import { ChangeOrdersService } from '../change-orders/change-orders.service';
import { PaymentGateway } from '../integrations/payments/payment-gateway';
import { InvoiceRepository } from '../invoices/invoice.repository';
import { InvoicesService } from '../invoices/invoices.service';
import { PaymentRepository } from '../payments/payment.repository';
import { PaymentsService } from '../payments/payments.service';
import type { QuotesService } from '../quotes/quotes.service';
import type { RequestsService } from '../requests/requests.service';
import { ApprovalRepository } from './approval.repository';
import { ApprovalsService } from './approvals.service';
import { ApprovedScopeReader } from './approved-scope';
import type { SellerNotices } from './seller-notices';

/** The seller's side of a request (approval, change orders, payments, invoices), built from the app's own services. */
export function createSellerSideServices(
  db: Db,
  config: Config,
  base: { requests: RequestsService; quotes: QuotesService; requestRows: RequestRepository; quoteRows: QuoteRepository; flow: FlowService; timeZoneOf: (organisationId: number) => Promise<string> },
  notices: SellerNotices,
) {
  const approvalRows = new ApprovalRepository(db);
  const changeOrderRows = new ChangeOrderRepository(db);
  const paymentRows = new PaymentRepository(db);
  const invoiceRows = new InvoiceRepository(db);
  const scopes = new ApprovedScopeReader(approvalRows, changeOrderRows);
  const gateway = config.payments ? new PaymentGateway(config.payments) : null;
  const invoices = new InvoicesService(db, base.requests, scopes, approvalRows, paymentRows, invoiceRows);
  return {
    approvals: new ApprovalsService(db, base.requests, base.quotes, base.quoteRows, base.flow, approvalRows, scopes, changeOrderRows, paymentRows, invoiceRows, notices, base.timeZoneOf),
    changeOrders: new ChangeOrdersService(db, base.requests, base.flow, approvalRows, scopes, changeOrderRows, notices),
    payments: new PaymentsService(db, base.requests, approvalRows, scopes, paymentRows, invoices, gateway, notices, config.publicUrl),
    invoices,
  };
}

export type SellerSideServices = ReturnType<typeof createSellerSideServices>;
