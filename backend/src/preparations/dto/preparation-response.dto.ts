import { ApiProperty } from '@nestjs/swagger';
import type { PreparationDto, PreparationMaterialDto, PreparationPreviewDto } from '@meritline/shared';
import { PreparationStepDto, PreparationStockDto } from './preparation-request.dto.js';

class BudgetRowDto {
  @ApiProperty({ enum: ['purity', 'mass', 'volume', 'volumeCalibration', 'volumeRepeatability', 'volumeTemperature'] })
  quantity: PreparationPreviewDto['stock']['budget'][number]['quantity'];
  @ApiProperty() label: string;
  @ApiProperty() value: number;
  @ApiProperty({ description: 'Standard uncertainty of the quantity.' }) u: number;
  @ApiProperty() relativeU: number;
  @ApiProperty({ description: '|∂c/∂x|·u(x), in the concentration unit.' }) contribution: number;
}

class StockResultDto {
  @ApiProperty() concentration: number;
  @ApiProperty({ description: 'Combined standard uncertainty.' }) u: number;
  @ApiProperty() relativeU: number;
  @ApiProperty({ example: 'mg/L' }) unit: string;
  @ApiProperty({ type: [BudgetRowDto] }) budget: BudgetRowDto[];
}

class StepResultDto {
  @ApiProperty() concentration: number;
  @ApiProperty() u: number;
  @ApiProperty() relativeU: number;
}

export class PreparationPreviewResponseDto implements PreparationPreviewDto {
  @ApiProperty({ type: StockResultDto }) stock: StockResultDto;
  @ApiProperty({ type: [StepResultDto] }) steps: StepResultDto[];
}

class PreparationMaterialResponseDto implements PreparationMaterialDto {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty() lot: string;
  @ApiProperty() certificateNumber: string;
  @ApiProperty({ format: 'date' }) expiresOn: string;
}

class SourceValuesDto {
  @ApiProperty() purity: number;
  @ApiProperty() uPurity: number;
}

class PersonDto {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
}

export class PreparationResponseDto implements PreparationDto {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty({ type: PreparationMaterialResponseDto, nullable: true }) material: PreparationMaterialResponseDto | null;
  @ApiProperty({ type: SourceValuesDto }) source: SourceValuesDto;
  @ApiProperty({ type: PreparationStockDto }) stock: PreparationStockDto;
  @ApiProperty({ type: [PreparationStepDto] }) steps: PreparationStepDto[];
  @ApiProperty({ type: PreparationPreviewResponseDto }) result: PreparationPreviewResponseDto;
  @ApiProperty() engineVersion: string;
  @ApiProperty({ type: PersonDto }) createdBy: PersonDto;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
}
