// The work-order transition table lives in shared/ because the client shows the allowed actions
// from the same table the server decides with.
export * from '../../../shared/workOrders/transitions'
