import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { ComputationView } from '@cribra/contracts';
import { listComputations, loadComputation } from './computation-views';

@Injectable()
export class ComputationsService {
  constructor(@InjectDataSource() private readonly db: DataSource) {}

  async get(id: string): Promise<ComputationView> {
    const c = await loadComputation(this.db, id);
    if (!c) throw new NotFoundException('Computation not found');
    return c;
  }

  list(kind?: string, status?: string): Promise<ComputationView[]> {
    return listComputations(this.db, kind, status);
  }
}
