/** What the signer agrees to, shown beside the checkbox and stored with the signature word for word. */
export function approvalConsentText(q: { contractorName: string; requestReference: string; quoteVersion: number; property: string }): string {
  return (
    `I am the seller of ${q.property}, or the listing agent acting for the seller. I approve the items marked ` +
    `"Approve" in quote ${q.requestReference} version ${q.quoteVersion} from ${q.contractorName}, at the prices shown, ` +
    `and I agree to pay their total by the payment option I choose next. Items marked "Decline" will not be done. ` +
    `The approved work is fixed by this signature: any later change needs a new quote version or a change order that I approve.`
  );
}

/** What the signer agrees to when deciding on a change order. */
export function changeOrderConsentText(q: { contractorName: string; number: number; decision: 'approve' | 'decline' }): string {
  return q.decision === 'approve'
    ? `I approve change order ${q.number} from ${q.contractorName} at the price shown; it joins the approved work and the balance.`
    : `I decline change order ${q.number} from ${q.contractorName}; the approved work stays as it was.`;
}
