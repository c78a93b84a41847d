/** The plan's geometry is shared with the service, which draws the same plan into the submittal package. */
export * from '../../../../../contract/daylight-plan';
