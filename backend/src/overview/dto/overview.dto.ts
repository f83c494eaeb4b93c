import { ApiProperty } from '@nestjs/swagger';
import type { OverviewDto } from '@meritline/shared';
import { describedList } from '../../common/openapi/api-responses.js';

export class OverviewResponseDto implements OverviewDto {
  @ApiProperty(describedList('The caller’s runs sent back by a reviewer: { id, title, comment, submittedAt }.'))
  returnedRuns: OverviewDto['returnedRuns'];
  @ApiProperty(describedList('Draft method versions: { methodId, methodName, versionId, number, createdAt }.'))
  versionsAwaitingActivation: OverviewDto['versionsAwaitingActivation'];
  @ApiProperty(
    describedList('Approvals signed although criteria were not met: { kind, id, title, methodId, signerName, at, justification }.'),
  )
  justifiedApprovals: OverviewDto['justifiedApprovals'];
  @ApiProperty(
    describedList('Control-chart signals of the last 30 days: { id, methodVersionId, methodName, versionNumber, series, message, at }.'),
  )
  driftSignals: OverviewDto['driftSignals'];
}
