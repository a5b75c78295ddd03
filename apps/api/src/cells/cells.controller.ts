import { Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Post, Put, Query, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { CellView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import { CellsService } from './cells.service';
import { CreateCellDto } from './dto/create-cell.dto';
import { DeleteCellDto } from './dto/delete-cell.dto';
import { ReorderCellsDto } from './dto/reorder-cells.dto';
import { UpdateCellDto } from './dto/update-cell.dto';

@ApiTags('cells')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller()
export class CellsController {
  constructor(
    private readonly cells: CellsService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Post('notebooks/:id/cells')
  @ApiOperation({ summary: 'Add a cell (appended, or inserted at `position`)' })
  async create(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: CreateCellDto,
  ): Promise<CellView> {
    await this.policy.authorize(user, 'cells.edit', id);
    return this.cells.create(user, id, body);
  }

  @Put('notebooks/:id/cells/order')
  @ApiOperation({ summary: 'Reorder all cells (409 on a stale notebook revision)' })
  async reorder(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: ReorderCellsDto,
  ): Promise<CellView[]> {
    await this.policy.authorize(user, 'cells.edit', id);
    return this.cells.reorder(user, id, body);
  }

  @Get('cells/:id')
  @ApiOperation({ summary: 'One cell with its latest run' })
  async get(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<CellView> {
    await this.policy.authorize(user, 'notebook.read', await this.cells.notebookOf(id));
    return this.cells.get(id);
  }

  @Put('cells/:id')
  @ApiOperation({ summary: 'Save source or kind (409 with the current cell on a stale revision)' })
  async update(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: UpdateCellDto,
  ): Promise<CellView> {
    await this.policy.authorize(user, 'cells.edit', await this.cells.notebookOf(id));
    return this.cells.update(user, id, body);
  }

  @Delete('cells/:id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Delete a cell and its runs (optionally only at `revision`)' })
  async remove(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() query: DeleteCellDto,
  ): Promise<void> {
    await this.policy.authorize(user, 'cells.edit', await this.cells.notebookOf(id));
    await this.cells.remove(user, id, query.revision);
  }
}
